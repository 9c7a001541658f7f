import { useQuery } from "@tanstack/react-query";
import { useSearchParams } from "react-router-dom";
import { z } from "zod";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { api } from "@/lib/api-client.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";

const badgeSchema = z.object({
  url: z.string(),
  qrPng: z.string(),
  issuedAt: z.string(),
  expiresAt: z.string(),
});

// A fresh code every 4 minutes while the page is open, before the server stops honoring the last one at 5.
const REFRESH_MS = 4 * 60_000;

export function Component() {
  const [search] = useSearchParams();
  const site = search.get("site");
  const path = site ? `/badge?site=${encodeURIComponent(site)}` : "/badge";
  const badge = useQuery({
    queryKey: ["badge", site],
    queryFn: () => api.get(path, badgeSchema),
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
          <img src={badge.data.qrPng} alt="Gate badge code to scan" width={320} height={320} />
          <figcaption className="text-sm text-slate-700">
            Good until {formatDateTime(badge.data.expiresAt)}
            {site
              ? " for the site you scanned."
              : ". Scan the site's gate sign first to tie it to that site."}
          </figcaption>
        </figure>
      )}
    </>
  );
}
