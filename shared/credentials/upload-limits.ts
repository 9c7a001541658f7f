/** The largest file any upload takes; a phone scan of a several-page certificate fits well under it. */
export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;

/** The same limit as people read it: "10 MB". */
export const MAX_UPLOAD_SIZE_WORDS = `${MAX_UPLOAD_BYTES / (1024 * 1024)} MB`;

/** What a document may be, by the media type read from its bytes, with the file name endings each goes by. */
export const DOCUMENT_FILE_TYPES = {
  "application/pdf": [".pdf"],
  "image/png": [".png"],
  "image/jpeg": [".jpg", ".jpeg"],
} as const satisfies Record<string, readonly string[]>;

export type DocumentMime = keyof typeof DOCUMENT_FILE_TYPES;
export const DOCUMENT_MIMES = Object.keys(DOCUMENT_FILE_TYPES) as DocumentMime[];

/** The `accept` attribute of a file input for documents: media types and endings both, for every browser. */
export const DOCUMENT_ACCEPT = [...Object.values(DOCUMENT_FILE_TYPES).flat(), ...DOCUMENT_MIMES].join(",");

/** The document types in words, for hints and refusals. */
export const DOCUMENT_TYPES_WORDS = "PDF, PNG or JPEG";
