import { useState, type FormEvent } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { requestMessageDtoSchema } from "@shared/service-requests/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextAreaField } from "@/components/ui/text-area-field.tsx";
import { api } from "@/lib/api-client.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { uploadWithProgress } from "@/lib/upload-with-progress.ts";
import { serviceRequestKeys } from "../api/service-request-keys.ts";

type Props = { requestId: number; companyId: number; title: string; readOnly: boolean };

/** The thread between the shop and one company; no other company sees it. Read-only once the request is decided. */
export function RequestThread({ requestId, companyId, title, readOnly }: Props) {
  const queryClient = useQueryClient();
  const path = `/service-requests/${requestId}/threads/${companyId}`;
  const thread = useQuery({
    queryKey: serviceRequestKeys.thread(requestId, companyId),
    queryFn: () => api.get(path, z.array(requestMessageDtoSchema)),
  });
  const [body, setBody] = useState("");
  const [file, setFile] = useState<File | null>(null);
  const post = useMutation({
    mutationFn: () => {
      const form = new FormData();
      form.set("body", body);
      if (file) form.set("file", file);
      return uploadWithProgress({ path, form, schema: requestMessageDtoSchema });
    },
    onSuccess: () => {
      setBody("");
      setFile(null);
      return queryClient.invalidateQueries({ queryKey: serviceRequestKeys.thread(requestId, companyId) });
    },
  });
  function onSubmit(e: FormEvent) {
    e.preventDefault();
    post.mutate();
  }
  return (
    <section aria-label={title} className="space-y-2">
      <h3 className="font-semibold">{title}</h3>
      <ol className="space-y-2">
        {(thread.data ?? []).map((m) => (
          <li key={m.id} className="rounded border border-ink-100 bg-white p-2 text-sm">
            <div className="text-xs text-ink-600">
              {m.author} · {formatDateTime(m.createdAt)}
            </div>
            <p className="whitespace-pre-wrap">{m.body}</p>
            {m.attachment && (
              <a className="underline" href={m.attachment.url}>
                {m.attachment.name}
              </a>
            )}
          </li>
        ))}
        {thread.data?.length === 0 && <li className="text-sm text-ink-600">No messages yet.</li>}
      </ol>
      {readOnly ? (
        <p className="text-sm text-ink-600">This thread is kept read-only now that the request is closed.</p>
      ) : (
        <form onSubmit={onSubmit} className="space-y-2">
          <FormError error={post.error} />
          <TextAreaField
            label="Message"
            name="body"
            rows={2}
            value={body}
            onChange={(e) => setBody(e.target.value)}
          />
          <input
            type="file"
            aria-label="Attach a file"
            accept="image/png,image/jpeg,application/pdf,.xlsx,.csv"
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
          />
          <Button type="submit" variant="secondary" pending={post.isPending}>
            Send message
          </Button>
        </form>
      )}
    </section>
  );
}
