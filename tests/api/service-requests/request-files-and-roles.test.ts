import { describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import {
  buildClearedCompany,
  buildShop,
  estimateBody,
  onlyInvite,
  raiseRequest,
} from "../../fixtures/build-service-request-world.ts";
import { minimalXlsx, storedZip } from "../../fixtures/tiny-zip.ts";

const t = useTestApp();

async function count(sql: string, bind: unknown[]) {
  const [row] = await sequelize().query<{ n: number }>(sql, { bind, type: QueryTypes.SELECT });
  return Number(row!.n);
}

async function oneCompanyRequest() {
  const shop = await buildShop(t.app);
  const a = await buildClearedCompany(t.app);
  const request = await raiseRequest(shop, await onlyInvite(shop, [a.company.id]));
  return { shop, a, request };
}

const attachmentRows = (requestId: number) =>
  count("SELECT count(*) AS n FROM service_request_attachments WHERE request_id = $1", [requestId]);
const documentsBy = (userId: number) =>
  count("SELECT count(*) AS n FROM documents WHERE uploaded_by = $1", [userId]);

describe("maintenance-history files on a service request", () => {
  it("keeps a real .xlsx workbook and serves it only as a download", async () => {
    const { shop, a, request } = await oneCompanyRequest();
    const res = await shop.agent
      .post(`/api/service-requests/${request.id}/attachments`)
      .attach("file", minimalXlsx(), "maintenance-history.xlsx");
    expect(res.status).toBe(201);
    const file = await a.admin.get(res.body.url).buffer(true);
    expect(file.status).toBe(200);
    expect(file.headers["content-type"]).toContain(
      "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
    );
    expect(file.headers["content-disposition"]).toMatch(/^attachment/);
    expect(file.headers["x-content-type-options"]).toBe("nosniff");
  });

  it.each([
    ["a plain zip renamed .xlsx", storedZip([{ name: "notes.txt", body: "not a workbook" }])],
    [
      "a zip that claims a workbook but holds no xl/workbook.xml",
      storedZip([
        {
          name: "[Content_Types].xml",
          body: '<Types><Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/></Types>',
        },
        { name: "xl/styles.xml", body: "<styleSheet/>" },
      ]),
    ],
    ["a Windows program renamed .xlsx", Buffer.concat([Buffer.from("MZ\x90\x00\x03"), Buffer.alloc(512, 1)])],
  ])("answers 415 to %s and keeps no row and no file", async (_label, bytes) => {
    const { shop, request } = await oneCompanyRequest();
    const before = await documentsBy(shop.user.id);
    const res = await shop.agent
      .post(`/api/service-requests/${request.id}/attachments`)
      .attach("file", bytes, "history.xlsx");
    expect(res.status).toBe(415);
    expect(res.body.error.fields[0].path).toBe("file");
    expect(await attachmentRows(request.id)).toBe(0);
    expect(await documentsBy(shop.user.id)).toBe(before);
  });

  it("keeps a UTF-8 .csv and serves it as a download with nosniff, never as a page", async () => {
    const { shop, a, request } = await oneCompanyRequest();
    const csv = "date,work\n2026-03-02,Way lube pump replaced — 4 hrs\n<script>alert(1)</script>,x\n";
    const res = await shop.agent
      .post(`/api/service-requests/${request.id}/attachments`)
      .attach("file", Buffer.from(csv), "history.csv");
    expect(res.status).toBe(201);
    const file = await a.admin.get(res.body.url).buffer(true);
    expect(file.headers["content-type"]).toMatch(/^text\/csv/);
    expect(file.headers["content-disposition"]).toMatch(/^attachment/);
    expect(file.headers["x-content-type-options"]).toBe("nosniff");
    expect(file.headers["content-security-policy"]).toContain("sandbox");
  });

  it.each([
    ["NUL bytes", Buffer.from("date,work\n\0\0\0binary")],
    ["bytes that are not UTF-8", Buffer.from([0x64, 0x61, 0x74, 0x65, 0x2c, 0xff, 0xfe, 0x0a])],
  ])("answers 415 to a .csv with %s and keeps nothing", async (_label, bytes) => {
    const { shop, request } = await oneCompanyRequest();
    const before = await documentsBy(shop.user.id);
    const res = await shop.agent
      .post(`/api/service-requests/${request.id}/attachments`)
      .attach("file", bytes, "history.csv");
    expect(res.status).toBe(415);
    expect(await attachmentRows(request.id)).toBe(0);
    expect(await documentsBy(shop.user.id)).toBe(before);
  });

  it("answers 413 to a .csv over 2 MB and keeps nothing", async () => {
    const { shop, request } = await oneCompanyRequest();
    const res = await shop.agent
      .post(`/api/service-requests/${request.id}/attachments`)
      .attach("file", Buffer.alloc(2 * 1024 * 1024 + 1, "a"), "history.csv");
    expect(res.status).toBe(413);
    expect(await attachmentRows(request.id)).toBe(0);
  });

  it("accepts a .csv in a company's message thread too", async () => {
    const { a, request } = await oneCompanyRequest();
    const res = await a.admin
      .post(`/api/service-requests/${request.id}/threads/${a.company.id}`)
      .field("body", "Our last visit log")
      .attach("file", Buffer.from("date,work\n2026-01-05,Ballscrew check\n"), "visits.csv");
    expect(res.status).toBe(201);
    expect(res.body.attachment).toMatchObject({ name: "visits.csv", mime: "text/csv" });
  });
});

describe("a technician of an invited company", () => {
  it("gets a clear 403 on the inbox, the request and the estimate routes", async () => {
    const { a, request } = await oneCompanyRequest();
    const inbox = await a.tech.get("/api/service-requests");
    const view = await a.tech.get(`/api/service-requests/${request.id}`);
    const estimate = await a.tech.post(`/api/service-requests/${request.id}/estimates`).send(estimateBody(a));
    const pass = await a.tech.post(`/api/service-requests/${request.id}/pass`).send({ reason: "busy" });
    for (const res of [inbox, view, estimate, pass]) {
      expect(res.status).toBe(403);
      expect(res.body.error.message).toEqual(expect.any(String));
    }
    expect(
      await count("SELECT count(*) AS n FROM service_request_estimates WHERE request_id = $1", [request.id]),
    ).toBe(0);
  });
});
