// One sniffer for every upload that takes a workbook (imports, service-request files), so they agree on what an .xlsx is.

export const ZIP_LOCAL_HEADER = Buffer.from([0x50, 0x4b, 0x03, 0x04]);
const ZIP_CENTRAL_HEADER = Buffer.from([0x50, 0x4b, 0x01, 0x02]);
const WORKBOOK_PART = Buffer.from("xl/workbook.xml");

/**
 * Reads the zip's central directory (PKWARE APPNOTE §4.3.12): the names of the parts and their unpacked sizes. An
 * Office Open XML spreadsheet always holds xl/workbook.xml (ECMA-376 Part 1 §12.3.23, by its usual part name).
 */
export function zipParts(bytes: Buffer): { namesWorkbook: boolean; unpackedBytes: number } {
  let namesWorkbook = false;
  let unpackedBytes = 0;
  for (
    let at = bytes.indexOf(ZIP_CENTRAL_HEADER);
    at !== -1;
    at = bytes.indexOf(ZIP_CENTRAL_HEADER, at + 4)
  ) {
    if (at + 46 > bytes.length) break;
    const size = bytes.readUInt32LE(at + 24);
    // 0xFFFFFFFF defers the size to a Zip64 field: no roster needs parts of 4 GB.
    unpackedBytes += size === 0xffffffff ? Number.POSITIVE_INFINITY : size;
    const nameLength = bytes.readUInt16LE(at + 28);
    if (bytes.subarray(at + 46, at + 46 + nameLength).equals(WORKBOOK_PART)) namesWorkbook = true;
  }
  return { namesWorkbook, unpackedBytes };
}

/** An .xlsx by its bytes: a zip (local header first) whose directory names the workbook part. */
export function isXlsxBytes(bytes: Buffer): boolean {
  return bytes.subarray(0, 4).equals(ZIP_LOCAL_HEADER) && zipParts(bytes).namesWorkbook;
}
