import { DateTime } from "luxon";
import { describe, expect, it } from "vitest";
import { useTestApp } from "../support/test-app.ts";
import { useMailCatcher } from "../support/mail-catcher.ts";
import { buildCompany } from "../support/build-company.ts";
import { buildProvider, buildCredentialRow, insuranceFields } from "../fixtures/build-credential-row.ts";
import { runReviewerDigest } from "../../jobs/reviewer-digest.ts";
import { Credential } from "../../server/credentials/model.ts";
import { deliverAll } from "./job-support.ts";

// The app is built for its database connection; the digest reads and writes through the models.
useTestApp();
const catcher = useMailCatcher();

const deps = { timeZone: "America/Chicago", publicUrl: "https://clearbench.test" };

describe("reviewers' daily digest", () => {
  it("e-mails each reviewer once a day with the queue count and the oldest waiting time", async () => {
    const { users } = await buildCompany("platform", ["reviewer"]);
    const p = await buildProvider();
    const waiting = await buildCredentialRow({
      companyId: p.company.id,
      typeCode: "general_liability",
      fields: insuranceFields(),
      state: "submitted",
      submittedBy: p.admin.id,
    });
    const asOf = new Date();
    // Older than anything other tests leave in the queue, so it is the oldest waiting document.
    await Credential.update(
      { submittedAt: new Date(asOf.getTime() - 400 * 86_400_000) },
      { where: { id: waiting.id } },
    );

    const first = await runReviewerDigest({ asOf }, deps);
    const again = await runReviewerDigest({ asOf: new Date(asOf.getTime() + 3_600_000) }, deps);
    await deliverAll(catcher);

    const mails = catcher.to(users.reviewer!.email);
    expect(first).toMatchObject({
      skipped: false,
      digestDate: DateTime.fromJSDate(asOf, { zone: "America/Chicago" }).toISODate(),
    });
    expect(again).toMatchObject({ skipped: false, sent: 0 });
    expect(mails).toHaveLength(1);
    expect(mails[0]?.subject).toMatch(/^Verification queue: \d+ waiting, oldest 400 days$/);
    expect(mails[0]?.text).toContain("https://clearbench.test/review");
  });
});
