import type { Transaction } from "sequelize";
import {
  answersInWindow,
  medianResponseMinutes,
  RESPONSE_WINDOW_DAYS,
} from "../../shared/service-requests/response-time.ts";
import { select } from "./sql.ts";

/**
 * Each company's median minutes from invitation to first answer over the last 90 days, by the shared rule. The one
 * function behind both the company's profile and the estimate comparison.
 */
export async function companyResponseMedians(
  companyIds: readonly number[],
  asOf: Date,
  transaction?: Transaction,
): Promise<Map<number, number | null>> {
  const result = new Map<number, number | null>(companyIds.map((id) => [id, null]));
  if (companyIds.length === 0) return result;
  const rows = await select<{ company_id: number; invited_at: Date; first_answer_at: Date | null }>(
    `SELECT company_id, invited_at, first_answer_at FROM service_request_invitations
      WHERE company_id = ANY($1::int[]) AND invited_at > $2::timestamptz - make_interval(days => $3) AND invited_at <= $2`,
    [[...companyIds], asOf, RESPONSE_WINDOW_DAYS],
    transaction,
  );
  for (const id of companyIds) {
    const own = rows
      .filter((r) => r.company_id === id)
      .map((r) => ({
        invitedAt: new Date(r.invited_at),
        firstAnswerAt: r.first_answer_at ? new Date(r.first_answer_at) : null,
      }));
    result.set(id, medianResponseMinutes(answersInWindow(own, asOf)));
  }
  return result;
}

/** How many of each company's estimates were accepted, ever. */
export async function acceptedEstimateCounts(companyIds: readonly number[]): Promise<Map<number, number>> {
  const rows = await select<{ company_id: number; n: number }>(
    `SELECT company_id, count(*)::int AS n FROM service_request_estimates
      WHERE company_id = ANY($1::int[]) AND status = 'accepted' GROUP BY company_id`,
    [[...companyIds]],
  );
  return new Map(companyIds.map((id) => [id, rows.find((r) => r.company_id === id)?.n ?? 0]));
}
