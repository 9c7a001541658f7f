import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot, signIn } from "../support/browser.ts";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { DEMO_PASSWORD } from "../../server/db/demo-scenario/index.ts";
import { demoBuyerRequirements } from "../../server/db/demo-scenario/buyer-site.ts";

const suite = useBrowserSuite();

const WIDTHS = [
  { name: "desktop", width: 1280, height: 900 },
  // A common phone width in CSS pixels (common practice for mobile layouts).
  { name: "phone", width: 390, height: 844 },
] as const;

/** Each role's first hour: the screens it opens every day. `:technician` is the first technician the directory lists. */
const roles: { role: string; email: string; pages: string[] }[] = [
  {
    role: "buyer",
    email: "buyer@marlow-precision.test",
    pages: ["/directory", ":technician", "/sites", "/work-orders"],
  },
  {
    role: "office",
    email: "office@kestrel-ridge.test",
    pages: ["/provider", "/provider/technicians", "/provider/documents"],
  },
  { role: "technician", email: "tobias@kestrel-ridge.test", pages: ["/technician", "/badge"] },
  { role: "reviewer", email: "reviewer@clearbench.test", pages: ["/review", "/account"] },
  {
    role: "admin",
    email: "admin@clearbench.test",
    pages: [
      "/admin/users",
      "/admin/companies",
      "/admin/job-runs",
      "/admin/reviews",
      "/admin/machine-catalog",
    ],
  },
];

async function firstDirectoryTechnician(page: Page): Promise<string> {
  await page.goto(`${suite.url}/directory`);
  const link = page.locator('a[href^="/directory/technicians/"]:visible').first();
  await link.waitFor();
  return (await link.getAttribute("href"))!;
}

/** Wider than the screen: the page scrolls sideways (the whole document, not a table's own scrolling box). */
const overflow = (page: Page) =>
  page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);

/** The innermost elements that reach past the right edge, to name in the failure. */
const pastTheEdge = (page: Page) =>
  page.evaluate(() =>
    [...document.querySelectorAll<HTMLElement>("body *")]
      .filter((e) => e.getBoundingClientRect().right > window.innerWidth + 1)
      .filter((e) => ![...e.children].some((c) => c.getBoundingClientRect().right > window.innerWidth + 1))
      .slice(0, 3)
      .map((e) => `<${e.tagName.toLowerCase()}> "${(e.textContent ?? "").trim().slice(0, 40)}"`)
      .join(", "),
  );

// Pages the every-page accessibility walk does not open at desktop width; the rest are checked there already.
const DESKTOP_AXE = new Set([":technician", "/admin/companies", "/admin/machine-catalog"]);

describe("every role's daily screens at desktop and phone width", () => {
  it.each(roles)(
    "has no sideways scrolling and no serious axe problem on the $role screens",
    async ({ role, email, pages }) => {
      const problems: string[] = [];
      const context = await suite.newContext({
        viewport: { width: WIDTHS[0].width, height: WIDTHS[0].height },
      });
      const page = await context.newPage();
      await signIn(page, suite.url, email, DEMO_PASSWORD);
      for (const size of WIDTHS) {
        await page.setViewportSize({ width: size.width, height: size.height });
        for (const pattern of pages) {
          const path = pattern === ":technician" ? await firstDirectoryTechnician(page) : pattern;
          await page.goto(`${suite.url}${path}`);
          await page.getByRole("heading", { level: 1 }).first().waitFor();
          await page.waitForLoadState("networkidle");
          const wider = await overflow(page);
          if (wider > 0)
            problems.push(
              `${size.name} ${path}: ${wider}px wider than the screen (${await pastTheEdge(page)})`,
            );
          if (size.name === "phone" || DESKTOP_AXE.has(pattern))
            problems.push(
              ...(await seriousAccessibilityProblems(page)).map((p) => `${size.name} ${path}: ${p}`),
            );
          if (size.name === "phone") await screenshot(page, `daily-${role}-${path.replace(/\W+/g, "-")}`);
        }
      }
      await context.close();

      expect(problems).toEqual([]);
    },
    // Two widths, axe on each phone page: on a shared machine a role can take over a minute.
    150_000,
  );
});

describe("every role's header between phone and desktop width", () => {
  // A small laptop and a tablet held sideways (common practice for layout checks): a role's whole bar of pages
  // has to fit or fold into the menu, never push the page sideways.
  it.each(roles)("fits the $role header at 1024 and 800 pixels", async ({ email, pages }) => {
    const context = await suite.newContext({ viewport: { width: 1024, height: 768 } });
    const page = await context.newPage();
    await signIn(page, suite.url, email, DEMO_PASSWORD);
    const path = pages[0]!;
    const problems: string[] = [];
    for (const width of [1024, 800]) {
      await page.setViewportSize({ width, height: 768 });
      await page.goto(`${suite.url}${path}`);
      await page.getByRole("heading", { level: 1 }).first().waitFor();
      await page.waitForLoadState("networkidle");
      const wider = await overflow(page);
      if (wider > 0)
        problems.push(`${width} ${path}: ${wider}px wider than the screen (${await pastTheEdge(page)})`);
    }
    await context.close();
    expect(problems).toEqual([]);
  });
});

describe("the demo buyer's first directory search", () => {
  it("opens on the buyer's site and judges against that site's requirement set", async () => {
    const context = await suite.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signIn(page, suite.url, "buyer@marlow-precision.test", DEMO_PASSWORD);

    await page.goto(`${suite.url}/directory`);
    const judged = page.getByTestId("directory-judged-against");
    await judged.waitFor();

    expect(new URL(page.url()).searchParams.get("siteId")).toMatch(/^\d+$/);
    expect(await judged.textContent()).toContain(
      `Judged against ${demoBuyerRequirements.name}, this site's requirement set`,
    );
    await context.close();
  });

  it("folds the filters behind a button that counts them at phone width, and opens them on request", async () => {
    const context = await suite.newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    await signIn(page, suite.url, "buyer@marlow-precision.test", DEMO_PASSWORD);
    await page.goto(`${suite.url}/directory`);
    const toggle = page.getByRole("button", { name: /Show filters/ });
    await toggle.waitFor();
    const filters = page.getByRole("search", { name: "Directory filters" });

    const hiddenAtFirst = await filters.isHidden();
    const label = await toggle.textContent();
    await toggle.click();
    const hide = page.getByRole("button", { name: /Hide filters/ });
    await hide.waitFor();
    const shownAfterClick = await filters.isVisible();
    const firstResultTop = await page.evaluate(
      () =>
        [...document.querySelectorAll('a[href^="/directory/technicians/"]')]
          .map((a) => a.getBoundingClientRect())
          .find((r) => r.height > 0)?.top ?? -1,
    );

    expect(hiddenAtFirst).toBe(true);
    expect(label).toContain("1 filter set"); // the default site
    expect(shownAfterClick).toBe(true);
    expect(await hide.getAttribute("aria-expanded")).toBe("true");
    expect(firstResultTop).toBeGreaterThan(0);
    await context.close();
  }, 60_000);

  it("offers the catalog's builder for a short name typed in the builder filter, in any case", async () => {
    const context = await suite.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signIn(page, suite.url, "buyer@marlow-precision.test", DEMO_PASSWORD);
    await page.goto(`${suite.url}/directory`);
    await page.getByText("Machine builder training, insurance limits and estimate").click();
    const builder = page.getByRole("combobox", { name: "Machine builder" });

    await builder.fill("  vantor ");
    const option = page.getByRole("listbox").getByRole("option", { name: /Vantor Machine Works/ });
    await option.waitFor();
    await builder.press("Tab");

    expect(await builder.inputValue()).toBe("Vantor Machine Works");
    await context.close();
  });
});
