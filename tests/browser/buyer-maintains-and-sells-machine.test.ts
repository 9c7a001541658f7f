import { describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot } from "../support/browser.ts";
import { useMailCatcher } from "../support/mail-catcher.ts";
import { runLapseJob } from "../../jobs/lapse.ts";
import { db } from "../../server/db/sequelize.ts";
import { calendarDateIn } from "../../shared/dates/local-time.ts";
import { addCalendarDays } from "../../shared/standing/iso-date.ts";
import { addCalendarMonths } from "../../shared/standing/training-validity.ts";

// The demo shop selling the machine (its Rockford plant is in Chicago's zone) and the demo shop buying it.
const SELLER = "buyer@marlow-precision.test";
const RECEIVER = "buyer@tamsin-gear.test";
const SITE = "Marlow Rockford plant";
const SITE_ZONE = "America/Chicago";
const MACHINE = "Vantor Machine Works VM-55 vertical mill";
const SERIAL = "VM55-4471";
const PLAN = "Annual inspection";
const COMPLETION_NOTE = "Annual inspection done: way lube pump serviced, backlash within limits on all axes.";
const SELLER_MESSAGE = "Night shift gate code is 4471; ask for Priya at the tool crib.";
// Due 20 days ahead: inside the 30-day reminder and before the 7-day one (the reminders of the maintenance plans).
const DUE_IN_DAYS = 20;

const suite = useBrowserSuite();
const catcher = useMailCatcher();

async function rows<T extends object>(sql: string, bind: unknown[] = []): Promise<T[]> {
  return db().query<T>(sql, { bind, type: QueryTypes.SELECT });
}

/** An invited company's office admin and one of its technicians cleared for the baseline who serves mills. */
async function anInvitedCompany(requestId: number) {
  const [company] = await rows<{ name: string; email: string; technician_id: number }>(
    `SELECT c.name, min(u.email) AS email, min(t.id) AS technician_id
       FROM service_request_invitations i JOIN companies c ON c.id = i.company_id
       JOIN users u ON u.company_id = i.company_id AND u.role = 'provider_admin' AND u.active
       JOIN technicians t ON t.company_id = i.company_id AND t.active AND t.technologies @> ARRAY['mill']::varchar[]
       JOIN technician_standings s ON s.technician_id = t.id AND s.requirement_set_id IS NULL
        AND s.standing IN ('cleared', 'lapsing')
      WHERE i.request_id = $1 GROUP BY c.id, c.name ORDER BY c.id LIMIT 1`,
    [requestId],
  );
  if (!company) throw new Error(`service request #${requestId} reached no cleared company serving mills`);
  return company;
}

/** "2027-03-31" as the screens print it, "Mar 31, 2027". */
const dateWords = (iso: string) =>
  new Date(`${iso}T00:00:00Z`).toLocaleDateString("en-US", {
    month: "short",
    day: "numeric",
    year: "numeric",
    timeZone: "UTC",
  });

describe("a maintenance manager keeps a machine serviced and then sells it", () => {
  it("adds the machine and its plan, is reminded, raises the planned service, confirms it, and the buying shop reads the history without the seller's people, prices or messages", async () => {
    const today = calendarDateIn(new Date(), SITE_ZONE);
    const lastDoneOn = addCalendarDays(addCalendarMonths(today, -12), DUE_IN_DAYS);
    const dueOn = addCalendarMonths(lastDoneOn, 12);
    const seller = await suite.signedInPage(SELLER, { timezoneId: SITE_ZONE });

    // 1. The machine, from the machines screen to the plant's page, builder and control picked from the catalog.
    await seller.getByRole("link", { name: "Machines", exact: true }).click();
    await seller.getByRole("heading", { level: 1, name: "Machines" }).waitFor();
    await seller.getByRole("link", { name: "Add machines at a site" }).click();
    const machines = seller.getByRole("region", { name: `Machines at ${SITE}` });
    const form = machines.getByRole("form", { name: "Add a machine" });
    await form.getByLabel("Machine builder").fill("vantor");
    await form.getByRole("option", { name: "Vantor Machine Works" }).click();
    await form.getByLabel("Control family").fill("kestle 4");
    await form.getByRole("option", { name: "Kestle 40" }).click();
    await form.getByLabel("Technology").selectOption("mill");
    await form.getByLabel("Model").fill("VM-55 vertical mill");
    await form.getByLabel("Serial number").fill(SERIAL);
    await form.getByLabel("Building").fill("North hall");
    await form.getByLabel("Bay").fill("Bay 4");
    await screenshot(seller, "maintains-and-sells-1-add-machine");
    await form.getByRole("button", { name: "Add machine" }).click();
    await machines.getByRole("link", { name: MACHINE }).waitFor();
    await seller.getByRole("link", { name: "Machines", exact: true }).click();
    const listed = seller.getByRole("row", { name: new RegExp(SERIAL) });
    await listed.waitFor();

    await expect(listed.textContent()).resolves.toMatch(
      new RegExp(`${MACHINE}.*${SERIAL}.*${SITE}.*North hall, Bay 4.*Mill`, "s"),
    );
    await expect(seriousAccessibilityProblems(seller)).resolves.toEqual([]);
    await screenshot(seller, "maintains-and-sells-1-machines");

    // 2. A yearly plan last done eleven months and some days ago, so it falls due inside the reminder window.
    await listed.getByRole("link", { name: MACHINE }).click();
    await seller.getByRole("heading", { level: 1, name: MACHINE }).waitFor();
    const machineId = Number(new URL(seller.url()).pathname.split("/").pop());
    await seller.getByRole("link", { name: "Maintenance plans" }).click();
    await seller.getByRole("button", { name: "Add a plan" }).click();
    const planForm = seller.getByRole("form", { name: "Add a maintenance plan" });
    await planForm.getByLabel("What is done").fill(PLAN);
    await planForm.getByLabel("Every (months)").fill("12");
    await planForm.getByLabel("Last done on").fill(lastDoneOn);
    await planForm.getByRole("button", { name: "Add plan" }).click();
    const card = seller.getByRole("listitem", { name: PLAN });
    await card.waitFor();
    await screenshot(seller, "maintains-and-sells-2-plan");

    await expect(card.getByTestId("next-due").innerText()).resolves.toBe(
      `Due in ${DUE_IN_DAYS} days, ${dateWords(dueOn)}`,
    );

    // 3. The daily job runs now; the buyer gets the 30-day reminder by e-mail and in the bell.
    const run = await runLapseJob({ asOf: new Date() }, { publicUrl: suite.url });
    await catcher.deliver();
    const subject = `Maintenance due in ${DUE_IN_DAYS} days (${dateWords(dueOn)}): ${PLAN} on Vantor Machine Works VM-55 vertical mill`;
    const mail = catcher.to(SELLER).filter((m) => m.subject === subject);
    const planLink = `${suite.url}/machines/${machineId}/maintenance?plan=`;
    await seller.goto(`${suite.url}/machines`);
    const bell = seller.getByRole("button", { name: /^Notifications, [1-9]\d* unread$/ });
    await bell.click();
    const reminder = seller.getByRole("link", { name: subject });
    await reminder.waitFor();
    await screenshot(seller, "maintains-and-sells-3-bell");

    expect(run.skipped).toBe(false);
    expect(mail).toHaveLength(1);
    expect(mail[0]!.text).toContain(
      `${PLAN}, every 12 months, on the Vantor Machine Works VM-55 vertical mill`,
    );
    expect(mail[0]!.text).toContain(planLink);
    expect(mail[0]!.html).toContain(`href="${planLink}`);
    expect(mail[0]!.html).toContain("Open the maintenance plans");
    // The reminder carries the lockout caution (29 CFR 1910.147, energy control during servicing).
    expect(mail[0]!.text).toContain("29 CFR 1910.147");

    // 4. From the bell to the plan, and one click raises the preventive-maintenance request with its window.
    await reminder.click();
    await seller.waitForURL(new RegExp(`/machines/${machineId}/maintenance\\?plan=\\d+$`));
    const named = seller.getByRole("listitem", { name: PLAN });
    await expect(named.getAttribute("aria-current")).resolves.toBe("true");
    await named.getByRole("button", { name: "Request this service" }).click();
    await seller.waitForURL(/\/buyer\/service-requests\/\d+$/);
    const requestId = Number(new URL(seller.url()).pathname.split("/").pop());
    const facts = seller.getByRole("region", { name: "The request" });
    await facts.waitFor();
    await screenshot(seller, "maintains-and-sells-4-request");

    const windowStart = addCalendarDays(dueOn, -14);
    // The window is the two weeks up to the due date (the product's own default for planned work).
    await expect(facts.textContent()).resolves.toContain(
      `Between ${dateWords(windowStart)} and ${dateWords(dueOn)}`,
    );
    await expect(
      facts.getByText("Preventive maintenance", { exact: false }).count(),
    ).resolves.toBeGreaterThan(0);
    await expect(facts.getByText(`${MACHINE} (Kestle 40)`).count()).resolves.toBe(1);

    // 5. An invited company estimates; the shop accepts, the company completes, the shop confirms.
    const company = await anInvitedCompany(requestId);
    const office = await suite.signedInAgent(company.email);
    await office
      .post(`/api/service-requests/${requestId}/estimates`)
      .send({
        technicianId: company.technician_id,
        hourlyRateCents: 14_500,
        travelRateCents: 9_500,
        mileageRateCents: 70,
        onSiteHours: 4,
        earliestArrival: `${windowStart}T08:00`,
        parts: [{ description: "Way wiper set", quantity: 1, unitPriceCents: 18_700 }],
        validUntil: dueOn,
      })
      .expect(201);
    await seller.reload();
    await seller.getByRole("button", { name: `Accept ${company.name}` }).click();
    await seller.getByRole("link", { name: /work order #\d+/ }).click();
    await seller.waitForURL(/\/work-orders\/\d+$/);
    const workOrderId = Number(new URL(seller.url()).pathname.split("/").pop());
    await office
      .post(`/api/work-orders/${workOrderId}/messages`)
      .send({ body: "Arriving at the north gate at eight." })
      .expect(201);
    const sellerAgent = await suite.signedInAgent(SELLER);
    await sellerAgent
      .post(`/api/work-orders/${workOrderId}/messages`)
      .send({ body: SELLER_MESSAGE })
      .expect(201);
    await office
      .post(`/api/work-orders/${workOrderId}/complete`)
      .send({
        hoursWorked: 3.5,
        travelHours: 1.5,
        note: COMPLETION_NOTE,
        partsUsed: [{ description: "Way wiper set", partNumber: "WW-55", quantity: 1 }],
      })
      .expect(200);
    await seller.reload();
    await seller.getByTestId("completion-summary").waitFor();
    await screenshot(seller, "maintains-and-sells-5-completed");
    await seller.getByRole("button", { name: "Confirm the work is done" }).click();
    await seller.getByRole("heading", { name: "Rating" }).waitFor();
    await screenshot(seller, "maintains-and-sells-5-confirmed");

    // 6. The machine's history shows the work; the plan starts again from the day it was done.
    await seller.goto(`${suite.url}/machines/${machineId}`);
    const history = seller.getByRole("region", { name: "Service history" });
    const entry = history.getByRole("listitem").filter({ hasText: COMPLETION_NOTE });
    await entry.waitFor();
    const ownEntry = await entry.innerText();
    await expect(seriousAccessibilityProblems(seller)).resolves.toEqual([]);
    await screenshot(seller, "maintains-and-sells-6-history");
    await seller.getByRole("link", { name: "Maintenance plans" }).click();
    const moved = seller.getByRole("listitem", { name: PLAN }).getByTestId("next-due");
    await moved.waitFor();
    const nextDue = addCalendarMonths(today, 12);
    await screenshot(seller, "maintains-and-sells-6-plan-moved");

    expect(ownEntry).toContain(`${dateWords(today)} · Preventive maintenance`);
    expect(ownEntry).toContain(company.name);
    expect(ownEntry).toContain(
      `Preventive maintenance (service request #${requestId}): ${PLAN} (every 12 months; last done ${dateWords(lastDoneOn)}`,
    );
    expect(ownEntry).toContain("Work order on Clearbench");
    expect(ownEntry).toContain("1 × Way wiper set (WW-55)");
    await expect(moved.innerText()).resolves.toMatch(new RegExp(`^Due in \\d+ days, ${dateWords(nextDue)}$`));
    await expect(seller.getByText(`Last done ${dateWords(today)}`).count()).resolves.toBe(1);

    // 7. Sold: the seller starts the transfer; the buying shop accepts it and reads the carried history.
    await seller.getByRole("link", { name: "Back to the machine" }).click();
    await seller.getByRole("link", { name: "Sell or transfer" }).click();
    await seller.getByLabel("E-mail of a buyer at the buying shop").fill(RECEIVER);
    await seller.getByRole("button", { name: "Start transfer" }).click();
    await seller.getByRole("heading", { name: "Waiting for the buying shop" }).waitFor();
    await screenshot(seller, "maintains-and-sells-7-transfer-started");
    const receiver = await suite.signedInPage(RECEIVER, { timezoneId: SITE_ZONE });
    await receiver.goto(`${suite.url}/machine-transfers`);
    const offer = receiver.getByRole("article", { name: "Vantor Machine Works VM-55 vertical mill" });
    await offer.getByLabel("Your site for this machine").selectOption({ index: 1 });
    await offer.getByRole("button", { name: "Accept transfer" }).click();
    await offer.getByText("Taken over").first().waitFor();
    await receiver.goto(`${suite.url}/machines/${machineId}`);
    await receiver.getByRole("heading", { level: 1, name: MACHINE }).waitFor();
    const carried = receiver.getByRole("region", { name: "Service history" });
    const carriedEntry = carried.getByRole("listitem").filter({ hasText: COMPLETION_NOTE });
    await carriedEntry.waitFor();
    const carriedText = await carriedEntry.innerText();
    const receiverPage = await receiver.locator("main").innerText();
    const [technician] = await rows<{ name: string }>("SELECT name FROM technicians WHERE id = $1", [
      company.technician_id,
    ]);
    const receiverAgent = await suite.signedInAgent(RECEIVER);
    await expect(seriousAccessibilityProblems(receiver)).resolves.toEqual([]);
    await screenshot(receiver, "maintains-and-sells-7-receiver-history");

    expect(carriedText).toContain(`${dateWords(today)} · Preventive maintenance`);
    expect(carriedText).toContain(company.name);
    expect(carriedText).toContain("1 × Way wiper set (WW-55)");
    // The seller's people, hours, prices, words and messages stay with the seller.
    expect(receiverPage).not.toContain(technician!.name);
    expect(receiverPage).not.toContain("3.5 h on site");
    expect(receiverPage).not.toContain("$");
    expect(receiverPage).not.toContain(SELLER_MESSAGE);
    expect(receiverPage).not.toContain("Priya");
    await expect(carriedEntry.getByRole("link", { name: /Work order #/ }).count()).resolves.toBe(0);
    const carriedJson = await receiverAgent.get(`/api/machines/${machineId}/history`).expect(200);
    expect(carriedJson.body.entries).toEqual([
      expect.objectContaining({
        date: today,
        kind: "preventive_maintenance",
        serviceCompanyName: company.name,
        note: COMPLETION_NOTE,
        workOrderId: null,
        technicianName: null,
        hoursOnSite: null,
        travelHours: null,
        problem: null,
        attachments: [],
        standingSnapshot: null,
      }),
    ]);
    expect(JSON.stringify(carriedJson.body)).not.toContain(SELLER_MESSAGE);
    await receiverAgent.get(`/api/work-orders/${workOrderId}`).expect(404);
    await receiverAgent.get(`/api/service-requests/${requestId}`).expect(404);
    const messages = await receiverAgent.get(`/api/work-orders/${workOrderId}/messages`);
    expect(messages.status).toBe(404);

    // 8. The seller keeps a read-only copy of the history up to the handover, in full, without the exports.
    await seller.goto(`${suite.url}/machine-transfers`);
    await seller.getByRole("link", { name: "Read your copy" }).click();
    await seller.getByRole("heading", { level: 1, name: MACHINE }).waitFor();
    const copy = seller.getByRole("region", { name: "Service history" });
    const copyEntry = copy.getByRole("listitem").filter({ hasText: COMPLETION_NOTE });
    await copyEntry.waitFor();
    await expect(seriousAccessibilityProblems(seller)).resolves.toEqual([]);
    await screenshot(seller, "maintains-and-sells-8-seller-copy");

    await expect(seller.getByText(/Sold to .* Your read-only copy of its history/).count()).resolves.toBe(1);
    await expect(copyEntry.innerText()).resolves.toContain(technician!.name);
    await expect(copy.getByRole("link", { name: "Download CSV" }).count()).resolves.toBe(0);
    await expect(seller.getByRole("button", { name: "Record outside work" }).count()).resolves.toBe(0);
  }, 180_000);
});
