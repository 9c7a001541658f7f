import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useSearchParams } from "react-router-dom";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { uploadWithProgress } from "@/lib/upload-with-progress.ts";
import { api } from "@/lib/api-client.ts";
import { badgeDtoSchema, badgePhotoSavedDtoSchema } from "@shared/gate/badge.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";

function PhotoForm({ hasPhoto }: { hasPhoto: boolean }) {
  const queryClient = useQueryClient();
  const upload = useMutation({
    mutationFn: (form: FormData) =>
      uploadWithProgress({
        path: "/badge/photo",
        form,
        schema: badgePhotoSavedDtoSchema,
      }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ["badge"] }),
  });
  return (
    <form
      className="mt-6 max-w-md space-y-2"
      onSubmit={(event) => {
        event.preventDefault();
        upload.mutate(new FormData(event.currentTarget));
      }}
    >
      <FormError error={upload.error} />
      <label htmlFor="badge-photo" className="block text-sm font-semibold text-ink-900">
        {hasPhoto ? "Replace your photo" : "Add your photo"} (JPEG or PNG)
      </label>
      <input
        id="badge-photo"
        name="file"
        type="file"
        accept="image/jpeg,image/png"
        required
        className="block"
      />
      <p className="text-sm text-ink-700">
        The front desk sees it when they scan your badge. It is shrunk and its location and camera details are
        removed.
      </p>
      <Button type="submit" variant="secondary" pending={upload.isPending}>
        Save photo
      </Button>
    </form>
  );
}

// A fresh code every 4 minutes while the page is open, before the server stops honoring the last one at 5.
const REFRESH_MS = 4 * 60_000;

export function Component() {
  const [search] = useSearchParams();
  const site = search.get("site");
  const path = site ? `/badge?site=${encodeURIComponent(site)}` : "/badge";
  const badge = useQuery({
    queryKey: ["badge", site],
    queryFn: () => api.get(path, badgeDtoSchema),
    refetchInterval: REFRESH_MS,
    refetchIntervalInBackground: false,
    refetchOnWindowFocus: "always",
  });
  return (
    <>
      <PageHeader
        title="Gate badge"
        description="Show this code at the gate or front office. It changes every few minutes, so a photo of it stops working."
      />
      {badge.isPending && <p role="status">Making your code…</p>}
      {badge.isError && <p role="alert">Your code could not be made. Check your connection and reload.</p>}
      {badge.data && (
        <figure className="flex flex-col items-start gap-2">
          {badge.data.photo && (
            <img src={badge.data.photo} alt="Your photo" className="h-32 w-32 rounded object-cover" />
          )}
          <img src={badge.data.qrPng} alt="Gate badge code to scan" width={320} height={320} />
          <figcaption className="text-sm text-slate-700">
            Good until {formatDateTime(badge.data.expiresAt)}
            {site
              ? " for the site you scanned."
              : ". Scan the site's gate sign first to tie it to that site."}
          </figcaption>
        </figure>
      )}
      {badge.data && <PhotoForm hasPhoto={!!badge.data.photo} />}
    </>
  );
}
