import pg from "pg";
import { LARGE_PASSWORD } from "./seed-large-data.ts";
import { signIn } from "./session-client.ts";

/** What the buyer describes for the routing preview; the same body raises the request whose comparison is measured. */
export function routingRequestBody(siteId: number) {
  return {
    siteId,
    technology: "mill",
    kind: "repair",
    machineState: "down",
    problem: "Spindle drive faults on start; machine down",
  };
}

// Enough answers to fill a comparison table the way a busy metro area would.
const ESTIMATES_WANTED = 12;

const isoDay = (d: Date) => d.toISOString().slice(0, 10);

/**
 * Raises one service request through the real API as the bench buyer and has up to a dozen invited companies answer
 * with an estimate, each from one of its technicians the server accepts as cleared. Returns the request's id and how
 * many estimates it holds, so the comparison page is measured at the large data set's routing scale.
 */
export async function prepareComparison(
  serverUrl: string,
  databaseUrl: string,
  buyer: Record<string, string>,
  siteId: number,
  say: (line: string) => void,
): Promise<{ requestId: number; invited: number; estimates: number }> {
  const json = { ...buyer, "content-type": "application/json" };
  const raised = await fetch(`${serverUrl}/api/service-requests`, {
    method: "POST",
    headers: json,
    body: JSON.stringify(routingRequestBody(siteId)),
  });
  if (raised.status !== 201)
    throw new Error(`raising the bench request answered ${raised.status}: ${await raised.text()}`);
  const request = (await raised.json()) as { id: number; invitations?: { companyId: number }[] };
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const invited = (
      await client.query<{ company_id: number }>(
        "SELECT company_id FROM service_request_invitations WHERE request_id = $1 ORDER BY company_id",
        [request.id],
      )
    ).rows.map((r) => r.company_id);
    const tomorrow = new Date(Date.now() + 86_400_000);
    const validUntil = new Date(Date.now() + 14 * 86_400_000);
    let estimates = 0;
    for (const companyId of invited) {
      if (estimates >= ESTIMATES_WANTED) break;
      // Offices are users 1..S with the company's own id.
      const office = await signIn(serverUrl, `office-${companyId}@service.large.test`, LARGE_PASSWORD);
      const technicians = (
        await client.query<{ id: number }>("SELECT id FROM technicians WHERE company_id = $1 ORDER BY id", [
          companyId,
        ])
      ).rows;
      for (const t of technicians) {
        const res = await fetch(`${serverUrl}/api/service-requests/${request.id}/estimates`, {
          method: "POST",
          headers: { ...office, "content-type": "application/json" },
          body: JSON.stringify({
            technicianId: t.id,
            hourlyRateCents: 11_500 + (companyId % 20) * 250,
            travelRateCents: 8_000,
            mileageRateCents: 70,
            onSiteHours: 4 + (companyId % 8) * 0.5,
            earliestArrival: `${isoDay(tomorrow)}T${String(8 + (companyId % 9)).padStart(2, "0")}:00`,
            parts: [{ description: "Spindle drive fuse kit", quantity: 1, unitPriceCents: 18_500 }],
            validUntil: isoDay(validUntil),
          }),
        });
        await res.arrayBuffer();
        if (res.status === 201) {
          estimates += 1;
          break;
        }
        // 409/422: that technician is not cleared for the set or has no base; try the company's next one.
      }
    }
    say(`  bench request ${request.id}: ${invited.length} companies invited, ${estimates} estimates`);
    return { requestId: request.id, invited: invited.length, estimates };
  } finally {
    await client.end();
  }
}
