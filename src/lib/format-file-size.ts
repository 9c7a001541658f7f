const KIB = 1024;
const MIB = 1024 * 1024;

/**
 * A file's size as people read it: "812 bytes", "14 KB", "2.3 MB". Binary multiples, as the upload limit is counted,
 * so a file the form refuses as over 10 MB never reads as "10.0 MB" (common practice in file managers).
 */
export function formatFileSize(bytes: number): string {
  if (bytes < KIB) return `${bytes} ${bytes === 1 ? "byte" : "bytes"}`;
  if (bytes < MIB) {
    const kb = bytes / KIB;
    return `${kb < 10 ? kb.toFixed(1).replace(/\.0$/, "") : Math.floor(kb)} KB`;
  }
  const mb = Math.floor((bytes / MIB) * 10) / 10;
  return `${mb.toFixed(1)} MB`;
}
