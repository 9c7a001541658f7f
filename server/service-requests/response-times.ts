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
  for (const id of companyIds)
    result.set(
      id,
      medianOfInvitations(
        rows.filter((r) => r.company_id === id),
        asOf,
      ),
    );
  return result;
}

/**
 * The companies' invitations of the window, as a correlated subquery for a statement that reads the company anyway
 * (the technician page): `company` is the SQL of its id, `asOf` the placeholder of the instant.
 */
export function invitationsInWindowSql(company: string, asOf: string): string {
  return `(SELECT coalesce(json_agg(json_build_object('invited_at', i.invited_at, 'first_answer_at', i.first_answer_at)), '[]'::json)
      FROM service_request_invitations i
     WHERE i.company_id = ${company} AND i.invited_at > ${asOf}::timestamptz - make_interval(days => ${RESPONSE_WINDOW_DAYS})
       AND i.invited_at <= ${asOf}::timestamptz)`;
}

/** The median response, by the shared rule, of one company's invitations (rows of either query above). */
export function medianOfInvitations(
  rows: readonly { invited_at: Date | string; first_answer_at: Date | string | null }[],
  asOf: Date,
): number | null {
  const own = rows.map((r) => ({
    invitedAt: new Date(r.invited_at),
    firstAnswerAt: r.first_answer_at ? new Date(r.first_answer_at) : null,
  }));
  return medianResponseMinutes(answersInWindow(own, asOf));
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
