import { useMutation, useQueryClient } from "@tanstack/react-query";
import { uploadWithProgress } from "@/lib/upload-with-progress.ts";
import { workOrderKeys } from "./work-order-keys.ts";
import { workOrderMessageDtoSchema } from "@shared/work-orders/schemas.ts";

export type PostMessageInput = {
  body: string;
  file?: File | undefined;
  onProgress?: (fraction: number) => void;
};

/** Multipart, so a file can go with the words; the file takes the same checks as any other upload. */
export function postWorkOrderMessage(id: number, { body, file, onProgress }: PostMessageInput) {
  const form = new FormData();
  form.set("body", body);
  if (file) form.set("file", file);
  return uploadWithProgress({
    path: `/work-orders/${id}/messages`,
    form,
    schema: workOrderMessageDtoSchema,
    onProgress,
  });
}

export function usePostWorkOrderMessage(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PostMessageInput) => postWorkOrderMessage(id, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: workOrderKeys.messages(id) }),
  });
}
