import { describe, expect, it } from "vitest";
import { useTestApp } from "../support/test-app.ts";
import {
  buildClearedProvider,
  buildCredentialRow,
  buildTechnician,
  insuranceFields,
  trainingFields,
} from "../fixtures/build-credential-row.ts";
import { runLapseJob } from "../../jobs/lapse.ts";
import { JOB_DEPS, storedStanding } from "./job-support.ts";

useTestApp();

const run = (asOf: string) => runLapseJob({ asOf: new Date(asOf) }, JOB_DEPS);

describe("a renewal verified before it starts", () => {
  it("clears the technician again on the day it comes into force, with no other event", async () => {
    const provider = await buildClearedProvider({ glExpires: "2027-07-15", wcExpires: "2028-07-15" });
    const technician = await buildTechnician(provider.company.id);
    await buildCredentialRow({
      companyId: provider.company.id,
      technicianId: technician.id,
      typeCode: "arc_flash",
      fields: trainingFields({ issueDate: "2026-06-01" }),
      submittedBy: provider.admin.id,
    });
    await run("2027-07-15T06:01:00Z");
    // Verified during the gap; its policy period starts 2027-07-20 at 12:01 a.m. standard time (ISO CG DS 01 wording, from memory).
    await buildCredentialRow({
      companyId: provider.company.id,
      typeCode: "general_liability",
      fields: insuranceFields({ effectiveDate: "2027-07-20", expirationDate: "2028-07-20" }),
      submittedBy: provider.admin.id,
    });

    await run("2027-07-19T12:00:00Z");
    const beforeStart = await storedStanding(technician.id);
    await run("2027-07-20T06:02:00Z");
    const afterStart = await storedStanding(technician.id);

    expect(beforeStart).toBe("not_cleared");
    expect(afterStart).toBe("cleared");
  });
});
