import { describe, expect, it } from "vitest";
import { useTestApp } from "../../support/test-app.ts";
import { buildMachineShop } from "../../fixtures/build-machine-shop.ts";

const t = useTestApp();

const shop = () => buildMachineShop(t.app, { machine: false });

let serialSeq = 0;
const nextSerial = () => `VX-${process.pid}-${++serialSeq}`;
const machine = (serialNumber: string) => ({
  builder: "Vantor Machine Works",
  controlFamily: "Kestle 40",
  technology: "mill",
  model: "VM-450",
  serialNumber,
  yearBuilt: 2019,
  inServiceOn: "2019-06-03",
  building: "B2",
  bay: "Bay 4",
  notes: "Coolant through spindle",
  state: "running",
});

describe("machine record", () => {
  it("keeps the record's year, in-service date, building, bay, notes and state", async () => {
    const { agent, siteId } = await shop();

    const res = await agent.post(`/api/sites/${siteId}/equipment`).send(machine(nextSerial()));

    expect(res.status).toBe(201);
    const page = await agent.get(`/api/machines/${res.body.id}`);
    expect(page.status).toBe(200);
    expect(page.body).toMatchObject({
      yearBuilt: 2019,
      inServiceOn: "2019-06-03",
      building: "B2",
      bay: "Bay 4",
      notes: "Coolant through spindle",
      state: "running",
      siteName: "East Works",
    });
  });

  it("refuses a date that is not on the calendar and an unknown state with 422 naming the field", async () => {
    const { agent, siteId } = await shop();

    const bad = await agent
      .post(`/api/sites/${siteId}/equipment`)
      .send({ ...machine(nextSerial()), inServiceOn: "2023-02-29", state: "idle" });

    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.body)).toContain("inServiceOn");
    expect(JSON.stringify(bad.body)).toContain("state");
  });

  it("answers 409 asking for a transfer when another shop holds the builder's serial, in any case or spacing", async () => {
    const first = await shop();
    const second = await shop();
    const serial = nextSerial();
    await first.agent.post(`/api/sites/${first.siteId}/equipment`).send(machine(serial)).expect(201);

    const res = await second.agent
      .post(`/api/sites/${second.siteId}/equipment`)
      .send({ ...machine(` ${serial.toLowerCase()} `), builder: "vantor   machine works" });

    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("transfer_required");
    expect(res.body.error.message).toMatch(/transfer/);
    const again = await first.agent.post(`/api/sites/${first.siteId}/equipment`).send(machine(serial));
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("conflict");
    // Another builder may use the same serial: uniqueness is per builder.
    await second.agent
      .post(`/api/sites/${second.siteId}/equipment`)
      .send({ ...machine(serial), builder: "Halden Axis Systems" })
      .expect(201);
  });

  it("lists the shop's machines across sites, filtered by builder alias, technology and state", async () => {
    const { agent, siteId } = await shop();
    const other = await agent
      .post("/api/sites")
      .send({ name: "West Works", addressLine: "9 Arbor Lane", postalCode: "60601" })
      .expect(201);
    await agent.post(`/api/sites/${siteId}/equipment`).send(machine(nextSerial())).expect(201);
    await agent
      .post(`/api/sites/${other.body.id}/equipment`)
      .send({ ...machine(nextSerial()), technology: "lathe", state: "down" })
      .expect(201);

    expect((await agent.get("/api/machines")).body).toHaveLength(2);
    expect((await agent.get("/api/machines").query({ builder: "vantor" })).body).toHaveLength(2);
    expect((await agent.get("/api/machines").query({ builder: "Halden" })).body).toHaveLength(0);
    const down = await agent.get("/api/machines").query({ state: "down" });
    expect(down.body.map((m: { technology: string }) => m.technology)).toEqual(["lathe"]);
    expect((await agent.get("/api/machines").query({ siteId: other.body.id })).body).toHaveLength(1);
  });

  it("answers 404 to another shop opening the machine and lists none of it", async () => {
    const owner = await shop();
    const stranger = await shop();
    const m = await owner.agent
      .post(`/api/sites/${owner.siteId}/equipment`)
      .send(machine(nextSerial()))
      .expect(201);

    expect((await stranger.agent.get(`/api/machines/${m.body.id}`)).status).toBe(404);
    expect((await stranger.agent.get("/api/machines")).body).toEqual([]);
  });
});
