import type { z } from "zod";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "@shared/api/error-body.ts";
import { env } from "@/config/env.ts";
import { ApiError, toApiError } from "./api-client.ts";

type UploadOptions<S extends z.ZodType> = {
  path: string;
  form: FormData;
  schema: S;
  /** Fraction sent, 0 to 1; called as the browser reports progress. */
  onProgress?: (fraction: number) => void;
  signal?: AbortSignal;
};

/**
 * A multipart POST over XMLHttpRequest: fetch() reports no upload progress, and people sending a
 * 10 MB scan from a phone need to see it move. Errors take the same ApiError shape as api-client.
 */
export function uploadWithProgress<S extends z.ZodType>({
  path,
  form,
  schema,
  onProgress,
  signal,
}: UploadOptions<S>) {
  return new Promise<z.output<S>>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", `${env.VITE_API_BASE}${path}`);
    xhr.withCredentials = true;
    xhr.setRequestHeader("accept", "application/json");
    xhr.setRequestHeader(CSRF_HEADER, CSRF_HEADER_VALUE);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress?.(event.loaded / event.total);
    };
    xhr.onerror = () =>
      reject(
        new ApiError(
          0,
          "unavailable",
          "The upload did not reach Clearbench. Check your connection and try again.",
        ),
      );
    xhr.onabort = () => reject(new ApiError(0, "unavailable", "The upload was canceled."));
    xhr.onload = () => {
      const response = new Response(xhr.status === 204 ? null : xhr.responseText, {
        status: xhr.status,
        statusText: xhr.statusText,
      });
      if (!response.ok) {
        void toApiError(response).then(reject);
        return;
      }
      onProgress?.(1);
      let body: unknown;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = undefined;
      }
      const parsed = schema.safeParse(body);
      if (parsed.success) resolve(parsed.data);
      else reject(new ApiError(xhr.status, "internal", "The server sent an answer this page cannot read."));
    };
    signal?.addEventListener("abort", () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}
