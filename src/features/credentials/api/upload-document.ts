import { useMutation } from "@tanstack/react-query";
import { uploadWithProgress } from "@/lib/upload-with-progress.ts";
import { uploadedDocumentDtoSchema } from "@shared/credentials/credential-shapes.ts";

export type UploadDocumentInput = {
  file: File;
  typeCode: string;
  technicianId?: number | undefined;
  onProgress?: (fraction: number) => void;
};

/** Step 1 of the upload: the file goes up, the server reads what it can and proposes fields. */
export function uploadDocument({ file, typeCode, technicianId, onProgress }: UploadDocumentInput) {
  const form = new FormData();
  form.set("typeCode", typeCode);
  if (technicianId) form.set("technicianId", String(technicianId));
  form.set("file", file);
  return uploadWithProgress({ path: "/documents", form, schema: uploadedDocumentDtoSchema, onProgress });
}

export const useUploadDocument = () => useMutation({ mutationFn: uploadDocument });
