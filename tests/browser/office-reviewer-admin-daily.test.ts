import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot } from "../support/browser.ts";

// A Copperline technician: the demo company's general liability lapsed days ago and its renewal waits for a reviewer.
const COPPERLINE_TECHNICIAN = "saoirse@copperline-field.test";
// The narrowest phone the pages are laid out for (common practice: 390 CSS px is a current mid-size phone).
const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1280, height: 900 };

const suite = useBrowserSuite();

const pageWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth);

describe("a technician's own standing page", () => {
  for (const [label, viewport] of [
    ["desktop", DESKTOP],
    ["phone", PHONE],
  ] as const) {
    it(`says at ${label} width that only the office can renew the company's lapsed policy, with the lapse column in view`, async () => {
      const page = await suite.signedInPage(COPPERLINE_TECHNICIAN, { viewport: viewport });
      await page.goto(`${suite.url}/technician`);
      await page.getByRole("heading", { name: "My standing" }).waitFor();
      const liability = page
        .getByRole("listitem")
        .filter({ hasText: /general liability/i })
        .filter({ hasText: "Only your office can renew this" })
        .first();
      await liability.waitFor();
      // The technician's own cards read by their printed day and never carry the office line.
      const ownCards = page
        .getByRole("row")
        .filter({ hasText: /valid through [A-Z][a-z]{2} \d{1,2}, \d{4}/ });
      expect(await ownCards.count()).toBeGreaterThan(0);
      expect(await ownCards.filter({ hasText: "Only your office can renew this" }).count()).toBe(0);

      const lapses = page.getByRole("columnheader", { name: "Lapses" });
      await lapses.scrollIntoViewIfNeeded();
      expect(await lapses.isVisible()).toBe(true);
      const box = await lapses.boundingBox();
      expect(box).not.toBeNull();
      expect(box!.x + box!.width).toBeLessThanOrEqual(viewport.width);
      expect(await pageWidth(page)).toBeLessThanOrEqual(viewport.width);
      await screenshot(page, `technician-standing-${label}`);
      expect(await seriousAccessibilityProblems(page)).toEqual([]);
    }, 120_000);
  }
});
