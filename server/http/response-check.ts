import { isDeepStrictEqual } from "node:util";
import type { z } from "zod";

/**
 * Holds an answer to the schema its route declares, as the client will parse it (after JSON, so dates are strings):
 * a field missing or of the wrong type, or a field the schema does not name, is a server bug. Turned on by
 * CHECK_RESPONSE_SHAPES (the test suite does), so every test that calls a route checks the shape of what it got back.
 */
export function checkDeclaredAnswer(route: string, schema: z.ZodType | undefined, answer: unknown): void {
  // A JSON answer with no schema would reach the client unchecked: every route that answers JSON declares its shape.
  if (!schema) throw new Error(`${route} answers JSON but declares no response schema`);
  const sent: unknown = JSON.parse(JSON.stringify(answer));
  const parsed = schema.safeParse(sent);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new Error(
      `The answer of ${route} breaks its declared schema at ${issue?.path.join(".") || "(root)"}: ${issue?.message}`,
    );
  }
  if (!isDeepStrictEqual(parsed.data, sent))
    throw new Error(`The answer of ${route} carries fields its declared schema does not name`);
}
