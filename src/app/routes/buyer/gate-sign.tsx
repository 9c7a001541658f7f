import { useQuery } from "@tanstack/react-query";
import { Link, useParams } from "react-router-dom";
import { Button } from "@/components/ui/button.tsx";
import { paths } from "@/config/paths.ts";
import { api } from "@/lib/api-client.ts";
import { gateSignDtoSchema } from "@shared/gate/badge.ts";

/** A sheet for the gate or front-office window; the header and buttons drop out when printed. */
export function Component() {
  const { siteId } = useParams();
  const sign = useQuery({
    queryKey: ["gate-sign", siteId],
    queryFn: () => api.get(`/sites/${encodeURIComponent(siteId ?? "")}/gate-sign`, gateSignDtoSchema),
    retry: false,
  });
  return (
    <article data-print-sheet className="mx-auto max-w-xl space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-3 print:hidden">
        <Link to={paths.buyer.sites} className="text-sm text-ink-700 underline">
          Back to sites
        </Link>
        <Button onClick={() => window.print()} disabled={!sign.data}>
          Print this sign
        </Button>
      </div>
      {sign.isPending && <h1 className="text-2xl font-semibold text-ink-900">Gate sign</h1>}
      {sign.isPending && <p role="status">Making the sign…</p>}
      {sign.isError && (
        <>
          <h1 className="text-2xl font-semibold text-ink-900">Gate sign</h1>
          <p role="alert">
            This site's sign could not be made. It may have been archived or belong to another shop.
          </p>
        </>
      )}
      {sign.data && (
        <section className="space-y-4 rounded-lg border-2 border-ink-900 bg-white p-6 text-center print:border-4">
          <p className="text-sm font-semibold tracking-wide text-ink-700 uppercase">
            Technicians: check in here
          </p>
          <h1 className="text-3xl font-bold text-ink-900">{sign.data.siteName}</h1>
          <img
            src={sign.data.qrPng}
            alt={`Gate sign code for ${sign.data.siteName}`}
            width={320}
            height={320}
            className="mx-auto"
          />
          <ol className="mx-auto max-w-sm list-decimal space-y-1 pl-6 text-left text-ink-900">
            <li>Scan this code with your phone camera and sign in to Clearbench.</li>
            <li>Your gate badge opens, tied to this site.</li>
            <li>Show the badge at the front desk; staff scan it to see whether you are cleared today.</li>
          </ol>
          <p className="text-sm text-ink-700">
            Site code <span className="font-mono">{sign.data.code}</span>
          </p>
        </section>
      )}
    </article>
  );
}
