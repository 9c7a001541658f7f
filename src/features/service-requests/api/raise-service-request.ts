import { useMutation, useQueryClient } from "@tanstack/react-query";
import { attachmentAddedDtoSchema, serviceRequestDtoSchema } from "@shared/service-requests/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { uploadWithProgress } from "@/lib/upload-with-progress.ts";
import { serviceRequestKeys } from "./service-request-keys.ts";
import type { ServiceRequestInput } from "./preview-service-request.ts";

/** Sends the request, then each attachment (same checks as any upload: type from the bytes, 10 MB at most). */
export async function raiseServiceRequest({ input, files }: { input: ServiceRequestInput; files: File[] }) {
  const created = await api.post("/service-requests", input, serviceRequestDtoSchema);
  for (const file of files) {
    const form = new FormData();
    form.set("file", file);
    await uploadWithProgress({
      path: `/service-requests/${created.id}/attachments`,
      form,
      schema: attachmentAddedDtoSchema,
    });
  }
  return created;
}

export function useRaiseServiceRequest() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: raiseServiceRequest,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: serviceRequestKeys.all }),
  });
}
