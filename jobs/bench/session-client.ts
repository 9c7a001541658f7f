import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";

/**
 * In production the session cookie is Secure and the app trusts one proxy: as behind a TLS-terminating load balancer,
 * every request to the production server says it arrived over HTTPS.
 */
export const BEHIND_TLS_PROXY = { "x-forwarded-proto": "https" };

/** Signs in through the real API and returns the session cookie plus the headers every later request needs. */
export async function signIn(
  baseUrl: string,
  email: string,
  password: string,
): Promise<Record<string, string>> {
  const res = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: "POST",
    headers: { "content-type": "application/json", [CSRF_HEADER]: CSRF_HEADER_VALUE, ...BEHIND_TLS_PROXY },
    body: JSON.stringify({ email, password }),
  });
  if (!res.ok) throw new Error(`sign-in as ${email} answered ${res.status}: ${await res.text()}`);
  const cookie = res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  if (!cookie) throw new Error(`sign-in as ${email} set no session cookie`);
  return { cookie, [CSRF_HEADER]: CSRF_HEADER_VALUE, ...BEHIND_TLS_PROXY };
}
