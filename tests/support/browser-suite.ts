import { afterAll, beforeAll } from "vitest";
import request from "supertest";
import type { Browser, BrowserContext, BrowserContextOptions, Page } from "playwright-core";
import { startBrowserServer } from "./browser-server.ts";
import { launchChromium, signIn } from "./browser.ts";
import { DEMO_PASSWORD } from "../../server/db/demo-scenario/index.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";

export type BrowserServer = Awaited<ReturnType<typeof startBrowserServer>>;

export interface BrowserSuite {
  readonly server: BrowserServer;
  readonly browser: Browser;
  /** The server's base URL. */
  readonly url: string;
  /** A browser context closed with the suite. Axe needs pages from a context, not from browser.newPage(). */
  newContext(options?: BrowserContextOptions): Promise<BrowserContext>;
  /** A fresh context signed in as a demo account (desktop width unless the options say otherwise). */
  signedInPage(email: string, options?: BrowserContextOptions): Promise<Page>;
  /** The same account over the API, for the steps of a journey that are not what the test is about. */
  signedInAgent(email: string): Promise<ReturnType<typeof request.agent>>;
}

/**
 * The real server on the demo scenario and one Chromium for a browser test file: started before its tests, every
 * context it opened closed after them, then the browser and the server.
 */
export function useBrowserSuite(env: Record<string, string> = {}): BrowserSuite {
  let server: BrowserServer | undefined;
  let browser: Browser | undefined;
  const contexts: BrowserContext[] = [];
  beforeAll(async () => {
    server = await startBrowserServer(env);
    browser = await launchChromium();
  }, 180_000);
  afterAll(async () => {
    for (const context of contexts) await context.close();
    await browser?.close();
    await server?.close();
  });

  const running = () => {
    if (!server || !browser) throw new Error("the browser suite is used before its beforeAll has run");
    return { server, browser };
  };
  const newContext = async (options: BrowserContextOptions = {}) => {
    const context = await running().browser.newContext(options);
    contexts.push(context);
    return context;
  };
  return {
    get server() {
      return running().server;
    },
    get browser() {
      return running().browser;
    },
    get url() {
      return running().server.url;
    },
    newContext,
    async signedInPage(email, options = {}) {
      const context = await newContext({ viewport: { width: 1280, height: 900 }, ...options });
      const page = await context.newPage();
      await signIn(page, running().server.url, email, DEMO_PASSWORD);
      return page;
    },
    async signedInAgent(email) {
      const agent = request.agent(running().server.url);
      agent.set(CSRF_HEADER, CSRF_HEADER_VALUE);
      await agent.post("/api/auth/sign-in").send({ email, password: DEMO_PASSWORD }).expect(200);
      return agent;
    },
  };
}
