import { describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import { buildMachineShop, machineBody, nextMachineSerial } from "../../fixtures/build-machine-shop.ts";
import { buildProvider } from "../../support/build-provider.ts";
import { buildWorkOrderWorld, workOrderAt } from "../../fixtures/build-work-order-world.ts";
import { cameraPhoto } from "../../fixtures/build-camera-photo.ts";
import { ownershipPeriods } from "../../../server/machines/ownership.ts";
import { historyAccess } from "../../../shared/machines/ownership-periods.ts";

const t = useTestApp();

type Shop = Awaited<ReturnType<typeof buildMachineShop>>;

const auditOf = async (transferId: number) =>
  (
    await sequelize().query<{ action: string; actorUserId: number }>(
      `SELECT action, actor_user_id AS "actorUserId" FROM audit_events
        WHERE subject_type = 'machine_transfer' AND subject_id = $1 ORDER BY id`,
      { bind: [transferId], type: QueryTypes.SELECT },
    )
  ).map((r) => [r.action, r.actorUserId]);

const noticesOf = (userId: number) =>
  sequelize().query<{ kind: string; link: string }>(
    "SELECT kind, link FROM notifications WHERE user_id = $1",
    {
      bind: [userId],
      type: QueryTypes.SELECT,
    },
  );
const mailTo = (address: string) =>
  sequelize().query<{ subject: string; textBody: string; htmlBody: string | null }>(
    `SELECT subject, text_body AS "textBody", html_body AS "htmlBody" FROM outbox_messages WHERE to_address = $1`,
    { bind: [address], type: QueryTypes.SELECT },
  );

async function pair() {
  const seller = await buildMachineShop(t.app);
  const receiver = await buildMachineShop(t.app, { machine: false, siteName: "North Annex" });
  return { seller, receiver };
}

const start = (seller: Shop, receiver: Shop, machineId = seller.machineId) =>
  seller.agent
    .post(`/api/machines/${machineId}/transfers`)
    .send({ email: receiver.user.email.toUpperCase(), note: "Sold with the spare chuck" });

describe("machine transfer", () => {
  it("tells the receiving shop by bell and e-mail, audits the start and lets each side do only its part", async () => {
    const { seller, receiver } = await pair();

    const res = await start(seller, receiver);

    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ state: "open", side: "seller", actions: ["withdraw"] });
    expect(res.body.toEmail).toBe(receiver.user.email);
    const incoming = await receiver.agent.get("/api/machine-transfers");
    expect(incoming.body.outgoing).toEqual([]);
    expect(incoming.body.incoming).toEqual([
      expect.objectContaining({
        id: res.body.id,
        side: "receiver",
        actions: ["accept", "decline"],
        fromShopName: seller.company.name,
        toEmail: null,
        note: "Sold with the spare chuck",
      }),
    ]);
    expect(incoming.body.incoming[0].machine).toMatchObject({
      builder: "Vantor Machine Works",
      model: "VM-450",
    });
    expect(await noticesOf(receiver.user.id)).toEqual([
      expect.objectContaining({ kind: "machine_transfer_started", link: "/machine-transfers" }),
    ]);
    const [mail] = await mailTo(receiver.user.email);
    expect(mail!.subject).toContain(seller.company.name);
    expect(mail!.textBody).toMatch(/\/machine-transfers/);
    expect(mail!.htmlBody).toMatch(/<a href="http[^"]+\/machine-transfers">/);
    expect(await auditOf(res.body.id)).toEqual([["machine_transfer.started", seller.user.id]]);
  });

  it("moves the machine, its photos and its ownership period to the receiver's site on acceptance", async () => {
    const { seller, receiver } = await pair();
    await seller.agent
      .post(`/api/machines/${seller.machineId}/photos`)
      .attach("file", await cameraPhoto(80, 60), "plate.jpg")
      .expect(201);
    const transfer = (await start(seller, receiver)).body;

    const res = await receiver.agent
      .post(`/api/machine-transfers/${transfer.id}/accept`)
      .send({ siteId: receiver.siteId, building: "Hall C", bay: "C-7" });

    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      state: "accepted",
      toSiteName: "North Annex",
      sellerRecord: null,
      actions: [],
    });
    const machine = await receiver.agent.get(`/api/machines/${seller.machineId}`);
    expect(machine.status).toBe(200);
    // The seller's notes name its own people, so they stay in the seller's copy; the location is the receiver's.
    expect(machine.body).toMatchObject({
      siteId: receiver.siteId,
      building: "Hall C",
      bay: "C-7",
      notes: null,
    });
    expect(machine.body.serialNumber).toBe(transfer.machine.serialNumber);
    expect((await receiver.agent.get(`/api/machines/${seller.machineId}/photos`)).body).toHaveLength(1);
    expect((await seller.agent.get(`/api/machines/${seller.machineId}`)).status).toBe(404);
    expect((await seller.agent.get(`/api/machines/${seller.machineId}/photos`)).status).toBe(404);
    expect((await seller.agent.get("/api/machines")).body).toEqual([]);

    const sellerCopy = await seller.agent.get(`/api/machine-transfers/${transfer.id}`);
    expect(sellerCopy.body).toMatchObject({ side: "seller", toSiteName: null });
    expect(sellerCopy.body.sellerRecord).toMatchObject({
      siteName: "East Works",
      building: "B2",
      bay: "Bay 4",
    });
    expect(sellerCopy.body.sellerRecord.notes).toMatch(/Dana Whitcomb/);

    const periods = await ownershipPeriods(seller.machineId);
    expect(periods.map((p) => p.companyId)).toEqual([seller.company.id, receiver.company.id]);
    expect(periods[0]!.to).toBe(res.body.decidedAt);
    expect(periods[1]).toMatchObject({ from: res.body.decidedAt, to: null });
    const sellerView = await seller.agent.get(`/api/machines/${seller.machineId}/ownership`);
    expect(sellerView.body).toEqual({
      current: false,
      periods: [{ from: periods[0]!.from, to: periods[0]!.to, yours: true }],
    });
    const receiverView = await receiver.agent.get(`/api/machines/${seller.machineId}/ownership`);
    expect(receiverView.body.current).toBe(true);
    expect(receiverView.body.periods.map((p: { yours: boolean }) => p.yours)).toEqual([false, true]);

    expect(await auditOf(transfer.id)).toEqual([
      ["machine_transfer.started", seller.user.id],
      ["machine_transfer.accepted", receiver.user.id],
    ]);
    expect((await noticesOf(seller.user.id)).map((n) => n.kind)).toEqual(["machine_transfer_accepted"]);
  });

  it("carries a confirmed job to the new owner's history without its prices, messages or people", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const workOrderId = await workOrderAt(world, "confirmed");
    await world.shop.agent
      .post(`/api/work-orders/${workOrderId}/messages`)
      .send({ body: "Gate code for Saturday is 4471" })
      .expect(201);
    const receiver = await buildMachineShop(t.app, { machine: false });
    const transfer = await world.shop.agent
      .post(`/api/machines/${world.equipmentId}/transfers`)
      .send({ email: receiver.user.email })
      .expect(201);
    await receiver.agent
      .post(`/api/machine-transfers/${transfer.body.id}/accept`)
      .send({ siteId: receiver.siteId })
      .expect(200);
    const [job] = await sequelize().query<{ confirmedAt: Date }>(
      `SELECT confirmed_at AS "confirmedAt" FROM work_orders WHERE id = $1`,
      { bind: [workOrderId], type: QueryTypes.SELECT },
    );

    const periods = await ownershipPeriods(world.equipmentId);
    const afterSale = new Date(Date.parse(periods[1]!.from) + 60_000);

    // The job is dated in the seller's period: the receiver reads its carried form, the seller all of it.
    expect(historyAccess(receiver.company.id, periods, job!.confirmedAt)).toBe("carried");
    expect(historyAccess(world.shop.company.id, periods, job!.confirmedAt)).toBe("own");
    // The seller's copy stops at the transfer; a third shop sees nothing.
    expect(historyAccess(world.shop.company.id, periods, afterSale)).toBe("none");
    expect(historyAccess(receiver.company.id, periods, afterSale)).toBe("own");
    // The work order itself (rates, hours, the message thread, the technician) stays the seller's.
    expect((await receiver.agent.get(`/api/work-orders/${workOrderId}`)).status).toBe(404);
    expect((await receiver.agent.get(`/api/work-orders/${workOrderId}/messages`)).status).toBe(404);
    expect((await world.shop.agent.get(`/api/work-orders/${workOrderId}`)).status).toBe(200);

    // The machine's history as each shop reads it through the API.
    type Entry = {
      key: string;
      workOrderId: number | null;
      technicianName: string | null;
      hoursOnSite: number | null;
    };
    const entryOf = async (agent: typeof receiver.agent) => {
      const res = await agent.get(`/api/machines/${world.equipmentId}/history`).expect(200);
      return (res.body.entries as Entry[]).find((e) => e.key === `wo-${workOrderId}`);
    };
    const carried = await entryOf(receiver.agent);
    expect(carried).toMatchObject({ workOrderId: null, technicianName: null, hoursOnSite: null });
    expect(carried).toMatchObject({
      serviceCompanyName: expect.any(String),
      attachments: [],
      standingSnapshot: null,
    });
    const sellersCopy = await entryOf(world.shop.agent);
    expect(sellersCopy).toMatchObject({ workOrderId, technicianName: expect.any(String) });
    const stranger = await buildMachineShop(t.app, { machine: false });
    expect((await stranger.agent.get(`/api/machines/${world.equipmentId}/history`)).status).toBe(404);
  });

  it("refuses a second acceptance, a withdrawal and a decline after acceptance with 409, changing nothing", async () => {
    const { seller, receiver } = await pair();
    const transfer = (await start(seller, receiver)).body;
    await receiver.agent
      .post(`/api/machine-transfers/${transfer.id}/accept`)
      .send({ siteId: receiver.siteId })
      .expect(200);

    const again = await receiver.agent
      .post(`/api/machine-transfers/${transfer.id}/accept`)
      .send({ siteId: receiver.siteId });
    const withdraw = await seller.agent.post(`/api/machine-transfers/${transfer.id}/withdraw`);
    const decline = await receiver.agent.post(`/api/machine-transfers/${transfer.id}/decline`).send({});

    expect([again.status, withdraw.status, decline.status]).toEqual([409, 409, 409]);
    expect(again.body.error.message).toMatch(/already accepted/);
    expect((await ownershipPeriods(seller.machineId)).length).toBe(2);
    expect((await auditOf(transfer.id)).map((a) => a[0])).toEqual([
      "machine_transfer.started",
      "machine_transfer.accepted",
    ]);
  });

  it("takes the machine over once when two acceptances race", async () => {
    const { seller, receiver } = await pair();
    const transfer = (await start(seller, receiver)).body;
    const accept = () =>
      receiver.agent.post(`/api/machine-transfers/${transfer.id}/accept`).send({ siteId: receiver.siteId });

    const results = await Promise.all([accept(), accept()]);

    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    expect((await ownershipPeriods(seller.machineId)).map((p) => p.companyId)).toEqual([
      seller.company.id,
      receiver.company.id,
    ]);
  });

  it("keeps the machine with the seller when the receiver declines, and lets a new transfer start", async () => {
    const { seller, receiver } = await pair();
    const transfer = (await start(seller, receiver)).body;

    const res = await receiver.agent
      .post(`/api/machine-transfers/${transfer.id}/decline`)
      .send({ reason: "We bought a different lathe" });

    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ state: "declined", declineReason: "We bought a different lathe" });
    expect((await seller.agent.get(`/api/machines/${seller.machineId}`)).status).toBe(200);
    expect((await receiver.agent.get(`/api/machines/${seller.machineId}`)).status).toBe(404);
    expect((await ownershipPeriods(seller.machineId)).length).toBe(1);
    expect(await auditOf(transfer.id)).toEqual([
      ["machine_transfer.started", seller.user.id],
      ["machine_transfer.declined", receiver.user.id],
    ]);
    expect((await noticesOf(seller.user.id)).map((n) => n.kind)).toEqual(["machine_transfer_declined"]);
    expect((await start(seller, receiver)).status).toBe(201);
  });

  it("lets the seller withdraw before acceptance; the receiver then cannot accept", async () => {
    const { seller, receiver } = await pair();
    const transfer = (await start(seller, receiver)).body;

    const res = await seller.agent.post(`/api/machine-transfers/${transfer.id}/withdraw`);
    const late = await receiver.agent
      .post(`/api/machine-transfers/${transfer.id}/accept`)
      .send({ siteId: receiver.siteId });

    expect(res.status).toBe(200);
    expect(res.body.state).toBe("withdrawn");
    expect(late.status).toBe(409);
    expect(late.body.error.message).toMatch(/withdrawn/);
    expect((await receiver.agent.get(`/api/machines/${seller.machineId}`)).status).toBe(404);
    expect(await auditOf(transfer.id)).toEqual([
      ["machine_transfer.started", seller.user.id],
      ["machine_transfer.withdrawn", seller.user.id],
    ]);
    expect((await noticesOf(receiver.user.id)).map((n) => n.kind).sort()).toEqual([
      "machine_transfer_started",
      "machine_transfer_withdrawn",
    ]);
  });

  it("refuses a second transfer of the same machine while one is open with 409", async () => {
    const { seller, receiver } = await pair();
    const other = await buildMachineShop(t.app, { machine: false });
    await start(seller, receiver).expect(201);

    const second = await start(seller, other);

    expect(second.status).toBe(409);
    expect(second.body.error.message).toMatch(/already waiting/);
    expect((await other.agent.get("/api/machine-transfers")).body.incoming).toEqual([]);
  });

  it("names the field when the e-mail is not a shop buyer's, is the seller's own, or the site is not the receiver's", async () => {
    const { seller, receiver } = await pair();
    const provider = await buildProvider(t.app);

    const unknown = await seller.agent
      .post(`/api/machines/${seller.machineId}/transfers`)
      .send({ email: "nobody-here@example.test" });
    const own = await seller.agent
      .post(`/api/machines/${seller.machineId}/transfers`)
      .send({ email: seller.user.email });
    const serviceCompany = await seller.agent
      .post(`/api/machines/${seller.machineId}/transfers`)
      .send({ email: provider.adminUser.email });
    const malformed = await seller.agent
      .post(`/api/machines/${seller.machineId}/transfers`)
      .send({ email: "not an address" });
    const transfer = (await start(seller, receiver)).body;
    const foreignSite = await receiver.agent
      .post(`/api/machine-transfers/${transfer.id}/accept`)
      .send({ siteId: seller.siteId });

    for (const res of [unknown, own, serviceCompany, malformed]) {
      expect(res.status).toBe(422);
      expect(res.body.error.fields[0].path).toBe("body.email");
    }
    expect(foreignSite.status).toBe(422);
    expect(foreignSite.body.error.fields[0].path).toBe("body.siteId");
    expect((await seller.agent.get(`/api/machines/${seller.machineId}`)).status).toBe(200);
  });

  it("answers a third shop like a missing transfer at every step, and a service company with 403", async () => {
    const { seller, receiver } = await pair();
    const stranger = await buildMachineShop(t.app);
    const provider = await buildProvider(t.app);
    const transfer = (await start(seller, receiver)).body;
    const calls = (agent: Shop["agent"], id: number) => [
      agent.get(`/api/machine-transfers/${id}`),
      agent.post(`/api/machine-transfers/${id}/accept`).send({ siteId: stranger.siteId }),
      agent.post(`/api/machine-transfers/${id}/decline`).send({}),
      agent.post(`/api/machine-transfers/${id}/withdraw`),
    ];

    const foreign = await Promise.all(calls(stranger.agent, transfer.id));
    const missing = await Promise.all(calls(stranger.agent, 99999999));
    const startOnForeign = await stranger.agent
      .post(`/api/machines/${seller.machineId}/transfers`)
      .send({ email: stranger.user.email });
    const byCompany = await Promise.all(calls(provider.admin, transfer.id));
    // Each side only its own step: the seller cannot accept, the receiver cannot withdraw.
    const sellerAccepts = await seller.agent
      .post(`/api/machine-transfers/${transfer.id}/accept`)
      .send({ siteId: seller.siteId });
    const receiverWithdraws = await receiver.agent.post(`/api/machine-transfers/${transfer.id}/withdraw`);

    expect(foreign.map((r) => r.status)).toEqual([404, 404, 404, 404]);
    expect(foreign.map((r) => r.body)).toEqual(missing.map((r) => r.body));
    expect(startOnForeign.status).toBe(404);
    expect(byCompany.map((r) => r.status)).toEqual([403, 403, 403, 403]);
    expect((await provider.admin.get("/api/machine-transfers")).status).toBe(403);
    expect([sellerAccepts.status, receiverWithdraws.status]).toEqual([404, 404]);
    expect((await stranger.agent.get("/api/machine-transfers")).body).toEqual({ incoming: [], outgoing: [] });
    expect((await stranger.agent.get(`/api/machines/${seller.machineId}/ownership`)).status).toBe(404);
    expect((await auditOf(transfer.id)).length).toBe(1);
  });

  it("asks the seller to wait for a transfer back rather than re-adding a machine it sold", async () => {
    const { seller, receiver } = await pair();
    const transfer = (await start(seller, receiver)).body;
    await receiver.agent
      .post(`/api/machine-transfers/${transfer.id}/accept`)
      .send({ siteId: receiver.siteId })
      .expect(200);

    const res = await seller.agent
      .post(`/api/sites/${seller.siteId}/equipment`)
      .send(machineBody(transfer.machine.serialNumber));

    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("transfer_required");
    expect(
      (
        await seller.agent
          .post(`/api/sites/${seller.siteId}/equipment`)
          .send(machineBody(nextMachineSerial()))
      ).status,
    ).toBe(201);
  });
});
