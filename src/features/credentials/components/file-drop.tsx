import { useId, useState } from "react";
import { useDropzone, type FileRejection } from "react-dropzone";
import {
  DOCUMENT_ACCEPT,
  DOCUMENT_FILE_TYPES,
  DOCUMENT_MIMES,
  DOCUMENT_TYPES_WORDS,
  MAX_UPLOAD_BYTES,
  MAX_UPLOAD_SIZE_WORDS,
} from "@shared/credentials/upload-limits.ts";

// The server's limits, checked here too so nobody waits for a refusal.
const accept = Object.fromEntries(
  Object.entries(DOCUMENT_FILE_TYPES).map(([mime, ends]) => [mime, [...ends]]),
);
const allowedTypes = new Set<string>(DOCUMENT_MIMES);
const tooLarge = `That file is larger than ${MAX_UPLOAD_SIZE_WORDS}. Scan at a lower resolution or send the PDF itself.`;

const problemOf = (file: File): string | null =>
  file.size === 0
    ? "That file is empty."
    : file.size > MAX_UPLOAD_BYTES
      ? tooLarge
      : file.type && !allowedTypes.has(file.type)
        ? `Use a ${DOCUMENT_TYPES_WORDS} file.`
        : null;

const rejectionMessage = (rejection: FileRejection): string =>
  rejection.errors.some((e) => e.code === "file-too-large")
    ? tooLarge
    : rejection.errors.some((e) => e.code === "too-many-files")
      ? "Send one file at a time."
      : `Use a ${DOCUMENT_TYPES_WORDS} file.`;

type FileDropProps = { onFile: (file: File) => void; disabled?: boolean; hint?: string };

/** A drop area for people with a mouse, and a plain labelled file input for everyone else (and for phones' cameras). */
export function FileDrop({ onFile, disabled = false, hint }: FileDropProps) {
  const [problem, setProblem] = useState<string | null>(null);
  const inputId = useId();
  const take = (file: File) => {
    const found = problemOf(file);
    setProblem(found);
    if (!found) onFile(file);
  };
  const { getRootProps, getInputProps, isDragActive } = useDropzone({
    accept,
    maxSize: MAX_UPLOAD_BYTES,
    multiple: false,
    noClick: true,
    noKeyboard: true,
    disabled,
    onDropAccepted: (files) => files[0] && take(files[0]),
    onDropRejected: (rejections) => rejections[0] && setProblem(rejectionMessage(rejections[0])),
  });

  return (
    <div className="space-y-2">
      <div
        {...getRootProps({
          className: `flex flex-col items-center gap-3 rounded-lg border-2 border-dashed px-4 py-8 text-center ${
            isDragActive ? "border-ink-700 bg-ink-50" : "border-ink-300 bg-white"
          } ${disabled ? "opacity-60" : ""}`,
        })}
      >
        <input {...getInputProps()} />
        <svg viewBox="0 0 24 24" className="size-8 text-ink-500" aria-hidden="true" focusable="false">
          <path
            d="M12 16V4m0 0-4.5 4.5M12 4l4.5 4.5M4 15v4h16v-4"
            className="fill-none stroke-current"
            strokeWidth="1.75"
          />
        </svg>
        <p className="font-medium text-ink-900">
          {isDragActive ? "Drop the file here" : "Drop a file here, or"}
        </p>
        <label
          htmlFor={inputId}
          className={`inline-flex min-h-12 cursor-pointer items-center rounded-md bg-accent-500 px-5 text-base font-semibold text-ink-900 shadow-sm hover:bg-accent-400 has-[+input:focus-visible]:outline-2 has-[+input:focus-visible]:outline-offset-2 has-[+input:focus-visible]:outline-ink-700 ${
            disabled ? "pointer-events-none" : ""
          }`}
        >
          Choose a file
        </label>
        <input
          id={inputId}
          type="file"
          accept={DOCUMENT_ACCEPT}
          disabled={disabled}
          className="peer sr-only"
          onChange={(event) => {
            const file = event.currentTarget.files?.[0];
            if (file) take(file);
            event.currentTarget.value = "";
          }}
        />
        <p className="text-sm text-ink-700">
          {hint ?? `${DOCUMENT_TYPES_WORDS}, up to ${MAX_UPLOAD_SIZE_WORDS}. A phone photo of a card works.`}
        </p>
      </div>
      {problem && (
        <p role="alert" className="text-sm font-medium text-red-800">
          {problem}
        </p>
      )}
    </div>
  );
}
