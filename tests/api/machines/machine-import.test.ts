import { describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import type request from "supertest";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import { buildMachineShop, machineBody, nextMachineSerial } from "../../fixtures/build-machine-shop.ts";
import { buildProvider } from "../../support/build-provider.ts";
import { countStored } from "../../support/count-uploads.ts";

const t = useTestApp();

type Agent = ReturnType<typeof request.agent>;

const upload = (
  agent: Agent,
  path: string,
  csv: string | Buffer,
  fields: Record<string, string> = {},
  name = "machines.csv",
  type = "text/csv",
) => {
  let req = agent.post(path);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach("file", Buffer.isBuffer(csv) ? csv : Buffer.from(csv, "utf8"), {
    filename: name,
    contentType: type,
  });
};

async function twoSiteShop() {
  const shop = await buildMachineShop(t.app, { machine: false, siteName: "Main Plant" });
  await shop.agent
    .post("/api/sites")
    .send({ name: "Annex, Building 9", addressLine: "9 Arbor Lane", postalCode: "60601" })
    .expect(201);
  return shop;
}

const machinesOf = (companyId: number) =>
  sequelize().query<{ builder: string; controlFamily: string; serialNumber: string; notes: string | null }>(
    `SELECT e.builder, e.control_family AS "controlFamily", e.serial_number AS "serialNumber", e.notes,
            e.technology, e.in_service_on::text AS "inServiceOn", s.name AS "siteName"
       FROM equipment e JOIN sites s ON s.id = e.site_id WHERE s.company_id = $1 ORDER BY e.id`,
    { bind: [companyId], type: QueryTypes.SELECT },
  );

/**
 * A spreadsheet's CSV export as it is written (RFC 4180 §2: CRLF records, fields with commas, quotes or line breaks in
 * double quotes, an inner quote doubled), with builder and control aliases and US dates as office files carry them.
 */
function realCsv(tag: string) {
  return [
    "Site,Builder,Control,Technology,Model,Serial number,Year built,In service since,Building,Bay,State,Notes",
    `Main Plant,VMW,K40,Mill,VM-450,${tag}-A1,2019,6/3/2019,B2,Bay 4,running,"Through-spindle coolant, 12,000 rpm"`,
    `"Annex, Building 9",Halden Axis Systems,Halden HX-7,Lathe,HL-220,${tag}-A2,2015,2015-01-20,9,,down,"Chuck jaws ""soft"", see binder`,
    `second shelf"`,
    `Main Plant,Strell,Spark 5,wire edm,SW-3,${tag}-A3,,,,,out of service,`,
    "",
  ].join("\r\n");
}

describe("machines import from CSV", () => {
  it("reads a real multi-line CSV with quoted commas and imports every row, with catalog names", async () => {
    const shop = await twoSiteShop();
    const tag = nextMachineSerial();
    const before = (await countStored(t.config.UPLOADS_DIR)).incoming;

    const preview = await upload(shop.agent, "/api/machines/import/preview", realCsv(tag));
    const commit = await upload(shop.agent, "/api/machines/import", realCsv(tag));

    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ goodCount: 3, badCount: 0 });
    expect(preview.body.rows.map((r: { line: number }) => r.line)).toEqual([2, 3, 4]);
    expect(commit.status).toBe(201);
    expect(commit.body.imported).toBe(3);
    const rows = await machinesOf(shop.company.id);
    expect(rows).toEqual([
      expect.objectContaining({
        builder: "Vantor Machine Works",
        controlFamily: "Kestle 40",
        technology: "mill",
        inServiceOn: "2019-06-03",
        siteName: "Main Plant",
        notes: "Through-spindle coolant, 12,000 rpm",
      }),
      expect.objectContaining({
        builder: "Halden Axis Systems",
        siteName: "Annex, Building 9",
        notes: 'Chuck jaws "soft", see binder\nsecond shelf',
      }),
      expect.objectContaining({ builder: "Strell Spark Systems", technology: "wire_edm", notes: null }),
    ]);
    const [periods] = await sequelize().query<{ n: number }>(
      "SELECT count(*)::int AS n FROM machine_ownerships WHERE equipment_id = ANY($1) AND to_at IS NULL",
      { bind: [commit.body.machineIds], type: QueryTypes.SELECT },
    );
    expect(periods!.n).toBe(3);
    const [audit] = await sequelize().query<{ after: { imported: number } }>(
      "SELECT after FROM audit_events WHERE action = 'equipment.imported' AND subject_id = $1",
      { bind: [shop.company.id], type: QueryTypes.SELECT },
    );
    expect(audit!.after.imported).toBe(3);
    expect((await countStored(t.config.UPLOADS_DIR)).incoming).toBe(before);
  });

  it("reports each problem with its row, column and reason, duplicates by builder and serial included", async () => {
    const shop = await twoSiteShop();
    const other = await buildMachineShop(t.app, { machine: false });
    const theirs = nextMachineSerial();
    const mine = nextMachineSerial();
    await other.agent.post(`/api/sites/${other.siteId}/equipment`).send(machineBody(theirs)).expect(201);
    const [mainPlant] = (await shop.agent.get("/api/sites")).body as { id: number }[];
    await shop.agent.post(`/api/sites/${mainPlant!.id}/equipment`).send(machineBody(mine)).expect(201);
    const tag = nextMachineSerial();
    const csv = [
      "Site,Builder,Control,Technology,Model,Serial number,Year built,In service since",
      `Main Plant,Vantor,K40,Mill,VM-1,${tag}-1,2019,2/30/2021`,
      `Back Lot,Acme Lathes,K40,Plasma cutter,VM-2,${tag}-2,19,`,
      `Main Plant,vantor machine works,K40,Mill,VM-3, ${tag.toLowerCase()}-1 ,,`,
      `Main Plant,Vantor Machine Works,Kestle 40,Mill,VM-4,${theirs},,`,
      `Main Plant,Vantor Machine Works,Kestle 40,Mill,VM-5,${mine},,`,
      `Main Plant,Vantor Machine Works,Kestle 40,Mill,,${tag}-6,,`,
      `Main Plant,Vantor Machine Works,Kestle 40,Mill,VM-7,${tag}-7,2020,`,
    ].join("\r\n");

    const res = await upload(shop.agent, "/api/machines/import/preview", csv);

    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ goodCount: 1, badCount: 6 });
    const problems = res.body.rows.flatMap((r: { problems: unknown[] }) => r.problems);
    const at = (line: number) =>
      problems
        .filter((p: { line: number }) => p.line === line)
        .map((p: { column: string; reason: string }) => `${p.column}: ${p.reason}`);
    // February has no 30th (Gregorian calendar).
    expect(at(2)).toEqual(['In service since: "2/30/2021" is not a date (YYYY-MM-DD or M/D/YYYY)']);
    expect(at(3)).toEqual([
      'Site: "Back Lot" is not one of your sites',
      'Builder: "Acme Lathes" is not in the builders catalog',
      'Technology: unknown technology "Plasma cutter"',
      expect.stringMatching(/^Year built: "19" is not a year from 1900/),
    ]);
    expect(at(4)).toEqual(["Serial number: the same builder and serial is also on line 2"]);
    expect(at(5)).toEqual([
      "Serial number: another shop holds this machine: ask that shop to start a transfer to you",
    ]);
    expect(at(6)).toEqual(["Serial number: already one of your machines"]);
    expect(at(7)).toEqual(["Model: missing"]);
    expect(at(8)).toEqual([]);
  });

  it("imports nothing from a file with a problem unless told to skip those rows, then imports the rest at once", async () => {
    const shop = await buildMachineShop(t.app, { machine: false });
    const tag = nextMachineSerial();
    const csv = [
      "Builder,Control,Technology,Model,Serial number",
      `Vantor,K40,Mill,VM-1,${tag}-1`,
      `Vantor,K40,Mill,VM-2,${tag}-1`,
      `Vantor,K40,Mill,VM-3,${tag}-3`,
    ].join("\r\n");

    const refused = await upload(shop.agent, "/api/machines/import", csv);
    const countAfterRefusal = (await machinesOf(shop.company.id)).length;
    const partial = await upload(shop.agent, "/api/machines/import", csv, { skipRowsWithProblems: "true" });
    const reimport = await upload(shop.agent, "/api/machines/import", csv, { skipRowsWithProblems: "true" });

    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toMatch(/nothing was imported/);
    expect(refused.body.error.fields).toEqual([
      {
        path: "file.line.3.serialNumber",
        message: "Serial number: the same builder and serial is also on line 2",
      },
    ]);
    expect(countAfterRefusal).toBe(0);
    expect(partial.status).toBe(201);
    expect(partial.body).toMatchObject({ imported: 2, skipped: [{ line: 3 }] });
    // A second run finds every row already on the shop's machines: no duplicate is created.
    expect(reimport.status).toBe(422);
    expect((await machinesOf(shop.company.id)).length).toBe(2);
  });

  it("asks which site rows without one go to when the shop has several, and names unmapped columns", async () => {
    const shop = await twoSiteShop();
    const sites = (await shop.agent.get("/api/sites")).body as { id: number; name: string }[];
    const csv = `Builder,Control,Technology,Model\r\nVantor,K40,Mill,VM-1\r\n`;

    const noSite = await upload(shop.agent, "/api/machines/import/preview", csv);
    const chosen = await upload(shop.agent, "/api/machines/import", csv, {
      defaultSiteId: String(sites[1]!.id),
    });
    const foreignSite = await upload(shop.agent, "/api/machines/import/preview", csv, {
      defaultSiteId: "99999999",
    });
    const unmapped = await upload(shop.agent, "/api/machines/import/preview", csv, {
      mapping: JSON.stringify({ builder: "Builder" }),
    });

    expect(noSite.body.rows[0].problems[0]).toMatchObject({ field: "site", column: "Site" });
    expect(chosen.status).toBe(201);
    expect((await machinesOf(shop.company.id))[0]).toMatchObject({ siteName: sites[1]!.name });
    expect(foreignSite.status).toBe(422);
    expect(foreignSite.body.error.fields[0].path).toBe("body.defaultSiteId");
    expect(unmapped.status).toBe(422);
    expect(unmapped.body.error.fields.map((f: { path: string }) => f.path)).toEqual([
      "body.mapping.controlFamily",
      "body.mapping.technology",
      "body.mapping.model",
    ]);
  });

  it("refuses a spreadsheet binary with 415 and a file over 10 MB with 413, keeping nothing; a service company gets 403", async () => {
    const shop = await buildMachineShop(t.app, { machine: false });
    const provider = await buildProvider(t.app);
    const before = (await countStored(t.config.UPLOADS_DIR)).incoming;
    // An .xlsx is a ZIP container: local file header signature PK\x03\x04 (PKWARE APPNOTE.TXT §4.3.7).
    const xlsx = Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x06, 0x00]);
    const big = Buffer.alloc(10 * 1024 * 1024 + 10, "a");

    const binary = await upload(shop.agent, "/api/machines/import", xlsx, {}, "machines.csv");
    const oversized = await upload(shop.agent, "/api/machines/import", big);
    const byCompany = await upload(provider.admin, "/api/machines/import", "Builder\r\nVantor\r\n");
    const template = await shop.agent.get("/api/machines/import/template");

    expect(binary.status).toBe(415);
    expect(oversized.status).toBe(413);
    expect(byCompany.status).toBe(403);
    expect((await machinesOf(shop.company.id)).length).toBe(0);
    expect((await countStored(t.config.UPLOADS_DIR)).incoming).toBe(before);
    expect(template.headers["content-type"]).toMatch(/^text\/csv/);
    expect(template.text.split("\r\n")[0]).toBe(
      "Site,Builder,Control,Technology,Model,Serial number,Year built,In service since,Building,Bay,State,Notes",
    );
  });
});
