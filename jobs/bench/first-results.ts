import { chromium } from "playwright-core";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";

export interface FirstResultsTiming {
  /** Largest contentful paint of /directory?siteId=... after signing in (ms from navigation start). */
  lcpMs: number;
  /** When the first result row was in the DOM and visible (ms from navigation start). */
  resultsVisibleMs: number;
}

/** Headless Debian Chromium on loopback: sign in as the buyer (API), then open the directory for a site. */
export async function measureFirstResults(
  baseUrl: string,
  email: string,
  password: string,
  siteId: number,
): Promise<FirstResultsTiming> {
  const browser = await chromium.launch({
    executablePath: "/usr/bin/chromium",
    headless: true,
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
  try {
    // The production server sets a Secure cookie only for requests that came through TLS (see BEHIND_TLS_PROXY).
    const context = await browser.newContext({
      viewport: { width: 1280, height: 800 },
      extraHTTPHeaders: { "x-forwarded-proto": "https" },
    });
    const signedIn = await context.request.post(`${baseUrl}/api/auth/sign-in`, {
      headers: { [CSRF_HEADER]: CSRF_HEADER_VALUE },
      data: { email, password },
    });
    if (!signedIn.ok()) throw new Error(`browser sign-in answered ${signedIn.status()}`);
    const page = await context.newPage();
    await page.addInitScript(() => {
      const w = window as unknown as { __lcp: number };
      w.__lcp = 0;
      new PerformanceObserver((list) => {
        for (const entry of list.getEntries()) w.__lcp = Math.max(w.__lcp, entry.startTime);
      }).observe({ type: "largest-contentful-paint", buffered: true });
    });
    await page.goto(`${baseUrl}/directory?siteId=${siteId}`);
    await page
      .locator('[aria-label="Cleared technicians"] li, table tbody tr')
      .first()
      .waitFor({ state: "visible", timeout: 30_000 });
    const resultsVisibleMs = await page.evaluate(() => performance.now());
    // LCP is reported after the paint; give the observer a frame or two.
    await page.waitForTimeout(300);
    const lcpMs = await page.evaluate(() => (window as unknown as { __lcp: number }).__lcp);
    return { lcpMs: Math.round(lcpMs), resultsVisibleMs: Math.round(resultsVisibleMs) };
  } finally {
    await browser.close();
  }
}
