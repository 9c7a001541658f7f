import { buildCertificatePdf } from "../../server/db/demo-scenario/documents/build-certificate-pdf.ts";
import { MAX_UPLOAD_BYTES } from "../../shared/credentials/upload-limits.ts";
import { readRssMb, sampleRss } from "./rss-sampler.ts";

export interface UploadBenchResult {
  uploads: number;
  p50: number;
  p95: number;
  fieldsFound: number;
  bigFileBytes: number;
  bigFileStatus: number;
  rssBeforeMb: number;
  rssPeakMb: number;
  rssGrowthMb: number;
}

async function upload(baseUrl: string, headers: Record<string, string>, bytes: Uint8Array, name: string) {
  const form = new FormData();
  form.set("typeCode", "general_liability");
  form.set("file", new Blob([bytes as Uint8Array<ArrayBuffer>], { type: "application/pdf" }), name);
  const t0 = performance.now();
  const res = await fetch(`${baseUrl}/api/documents`, { method: "POST", headers, body: form });
  const body = (await res.json()) as { extraction?: { found?: string[] } };
  return { ms: performance.now() - t0, status: res.status, found: body.extraction?.found?.length ?? 0 };
}

const pct = (sorted: number[], p: number) =>
  sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;

/**
 * Upload-and-extract of generated two-page certificates, one at a time (each a different PDF, so each is hashed, read
 * and stored), then one file just under the 10 MB limit while the server's RSS is sampled.
 */
export async function benchUploads(
  baseUrl: string,
  headers: Record<string, string>,
  serverPid: number,
  count: number,
): Promise<UploadBenchResult> {
  const pdfs = await Promise.all(
    Array.from({ length: count + 3 }, (_v, i) => buildCertificatePdf({ seed: 7000 + i, pages: 2 })),
  );
  for (const warm of pdfs.slice(0, 3)) await upload(baseUrl, headers, warm.bytes, "warm-up.pdf");
  const times: number[] = [];
  let fieldsFound = 0;
  for (const [i, pdf] of pdfs.slice(3).entries()) {
    const r = await upload(baseUrl, headers, pdf.bytes, `certificate-${i}.pdf`);
    if (r.status !== 201) throw new Error(`upload answered ${r.status}`);
    times.push(r.ms);
    fieldsFound += r.found;
  }
  times.sort((a, b) => a - b);

  // A real two-page certificate padded with a PDF comment to just under the limit: valid, and as large as allowed.
  const base = pdfs[0]!.bytes;
  const big = new Uint8Array(MAX_UPLOAD_BYTES - 1024);
  big.set(base);
  big.set(new TextEncoder().encode("\n%"), base.length);
  big.fill(0x20, base.length + 2);
  await new Promise((r) => setTimeout(r, 500));
  const before = readRssMb(serverPid);
  const sampler = sampleRss(serverPid, 10);
  const r = await upload(baseUrl, headers, big, "large-certificate.pdf");
  await new Promise((r) => setTimeout(r, 200));
  const peak = sampler.stop();
  return {
    uploads: times.length,
    p50: Math.round(pct(times, 50)),
    p95: Math.round(pct(times, 95)),
    fieldsFound: Math.round(fieldsFound / times.length),
    bigFileBytes: big.length,
    bigFileStatus: r.status,
    rssBeforeMb: Math.round(before),
    rssPeakMb: Math.round(peak),
    rssGrowthMb: Math.round((peak - before) * 10) / 10,
  };
}
