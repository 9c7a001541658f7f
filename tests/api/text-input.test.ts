import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import type { z } from "zod";
import { buildTestApp, type TestApp } from "../support/test-app.ts";
import { buildProvider, signedInAgent } from "../support/build-provider.ts";
import { certificateFields } from "../support/submit-credential.ts";
import { buildCertificatePdf } from "../fixtures/build-certificate-pdf.ts";
import { buildWorkOrderWorld, workOrderAt } from "../fixtures/build-work-order-world.ts";
import { routeTable, type RouteEntry } from "../../server/http/route.ts";
import { fieldSetSchemas } from "../../shared/credentials/credential-fields.ts";
import type { Role } from "../../shared/accounts/schemas.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";

type TestAgent = ReturnType<typeof request.agent>;
let t: TestApp;
let provider: Awaited<ReturnType<typeof buildProvider>>;
const agents = {} as Record<Role, TestAgent>;
beforeAll(async () => {
  t = buildTestApp({ SIGN_IN_ATTEMPTS_PER_15_MIN: "100000", SIGN_IN_FAILURES_PER_IP_PER_15_MIN: "100000" });
  provider = await buildProvider(t.app);
  agents.provider_admin = provider.admin;
  agents.technician = provider.tech;
  agents.reviewer = (await signedInAgent(t.app, "platform", "reviewer")).agent;
  agents.admin = (await signedInAgent(t.app, "platform", "admin")).agent;
  agents.buyer = (await signedInAgent(t.app, "shop", "buyer")).agent;
});
afterAll(() => t.close());

// ---- every string a schema accepts, found by walking the zod definitions (zod 4 keeps them at `_zod.def`) ----
type Def = { type: string; [k: string]: unknown };
const defOf = (s: unknown) => (s as { _zod: { def: Def } })._zod.def;

/** Every schema that parses a string, with the path where it sits. */
function stringLeaves(schema: unknown, path: string, out: { path: string; schema: z.ZodType }[] = []) {
  const def = defOf(schema);
  const walk = (child: unknown, suffix: string) => child && stringLeaves(child, path + suffix, out);
  switch (def.type) {
    case "string":
      out.push({ path, schema: schema as z.ZodType });
      break;
    case "object":
      for (const [k, v] of Object.entries(def.shape as Record<string, unknown>)) walk(v, `.${k}`);
      break;
    case "record":
      walk(def.keyType, ".<key>");
      walk(def.valueType, ".<value>");
      break;
    case "array":
      walk(def.element, "[]");
      break;
    case "union":
      (def.options as unknown[]).forEach((o, i) => walk(o, `|${i}`));
      break;
    case "intersection":
      walk(def.left, "");
      walk(def.right, "");
      break;
    case "pipe":
      walk(def.in, "");
      walk(def.out, "");
      break;
    case "tuple":
      (def.items as unknown[]).forEach((o, i) => walk(o, `[${i}]`));
      break;
    case "lazy":
      walk((def.getter as () => unknown)(), "");
      break;
    default:
      if (def.innerType) walk(def.innerType, "");
  }
  return out;
}

const schemasUnderTest = [
  ...routeTable.flatMap((r) =>
    (["params", "query", "body"] as const)
      .filter((part) => r.schemas[part])
      .map((part) => ({ name: `${r.method} ${r.path} ${part}`, schema: r.schemas[part] })),
  ),
  ...Object.entries(fieldSetSchemas).map(([name, schema]) => ({ name: `credential fields ${name}`, schema })),
];

const HOSTILE = { nul: "\u0000", bell: "\u0007", escape: "\u001b", c1: "\u0085", surrogate: "\ud800" };

describe("every text input", () => {
  it("refuses NUL, other control characters and lone surrogates wherever plain text is accepted", () => {
    const accepted: string[] = [];
    let probed = 0;

    for (const { name, schema } of schemasUnderTest) {
      for (const leaf of stringLeaves(schema, name)) {
        // A length the leaf accepts as plain text, so a refusal below can only be the character's doing.
        const plain = ["x", "xx", "xxxxx", "x".repeat(12), "x".repeat(30)].find(
          (s) => leaf.schema.safeParse(s).success,
        );
        if (!plain) continue;
        probed += 1;
        for (const [what, char] of Object.entries(HOSTILE)) {
          const spoiled = plain.slice(0, -1) + char;
          if (leaf.schema.safeParse(spoiled).success) accepted.push(`${leaf.path} accepts ${what}`);
        }
      }
    }

    expect(probed).toBeGreaterThan(40);
    expect(accepted).toEqual([]);
  });

  it("keeps tabs and line breaks in text that may span lines", () => {
    const leaves = schemasUnderTest
      .filter((s) => s.name.startsWith("post /api/work-orders/:workOrderId/decline body"))
      .flatMap((s) => stringLeaves(s.schema, s.name))
      .filter((leaf) => leaf.path.endsWith("reason"));

    const parsed = leaves[0]!.schema.safeParse("Machine down:\r\n\tspindle seized");

    expect(leaves).toHaveLength(1);
    expect(parsed.data).toBe("Machine down:\n\tspindle seized");
  });
});

// ---- the same, as a caller sees it ----
function callerFor(route: RouteEntry) {
  const roles = route.policy.roles;
  const role: Role = roles === "anyone" || roles === "signed_in" ? "buyer" : roles[0]!;
  return agents[role] as unknown as Record<string, (p: string) => request.Test>;
}

const topLevelStrings = (schema: unknown) =>
  schema
    ? [
        ...new Set(
          stringLeaves(schema, "")
            .map((l) => l.path.split(/[.[|]/)[1]!)
            .filter(Boolean),
        ),
      ]
    : [];

describe("a NUL in any field of any route", () => {
  it("is refused with a reason, never a server error", async () => {
    const failures: string[] = [];
    let requests = 0;

    for (const route of routeTable) {
      if (route.path === "/api/auth/sign-out") continue;
      const path = route.path.replace(/:([A-Za-z]+)/g, "1");
      const fields = Object.fromEntries(
        Object.keys(fieldSetSchemas.insurance.shape).map((k) => [k, `Text\u0000${k}`]),
      );
      for (const part of ["query", "body"] as const) {
        for (const key of topLevelStrings(route.schemas[part])) {
          requests += 1;
          const value = key === "fields" ? fields : `Kestrel\u0000${key}`;
          const call = callerFor(route)[route.method]!(path).set(CSRF_HEADER, CSRF_HEADER_VALUE);
          const res =
            part === "query" ? await call.query({ [key]: value }) : await call.send({ [key]: value });
          if (res.status >= 500 || res.status < 400 || !res.body?.error?.message)
            failures.push(`${route.method} ${route.path} ${part}.${key} -> ${res.status}`);
        }
      }
    }

    expect(requests).toBeGreaterThan(40);
    expect(failures).toEqual([]);
  }, 120_000);

  it("refuses a NUL or a lone surrogate in a technician's name with 422 naming the field", async () => {
    const base = {
      postalCode: "60601",
      serviceRadiusKm: 100,
      hourlyRateCents: 12000,
      travelRateCents: 9000,
    };

    const nul = await provider.admin.post("/api/technicians").send({ ...base, name: "Oskar\u0000Brandvold" });
    const surrogate = await provider.admin.post("/api/technicians").send({ ...base, name: "Oskar \ud83d" });
    const fine = await provider.admin
      .post("/api/technicians")
      .send({ ...base, name: "Oskar Brandvold-Ñúñez" });

    expect(nul.status).toBe(422);
    expect(nul.body.error.fields).toEqual([expect.objectContaining({ path: "body.name" })]);
    expect(surrogate.status).toBe(422);
    expect(surrogate.body.error.fields[0].path).toBe("body.name");
    expect(fine.status).toBe(201);
    expect(fine.body.name).toBe("Oskar Brandvold-Ñúñez");
  });

  it("refuses a NUL in a credential field with 422 naming the field", async () => {
    const { bytes, values } = await buildCertificatePdf({ seed: 4101 });
    const up = await provider.admin
      .post("/api/documents")
      .field("typeCode", "general_liability")
      .attach("file", Buffer.from(bytes), "coi-4101.pdf");
    const fields = { ...certificateFields(values, "general_liability"), policyNumber: "GL\u0000-4101" };

    const res = await provider.admin
      .post("/api/credentials")
      .send({ documentId: up.body.document.id, typeCode: "general_liability", fields });

    expect(up.status).toBe(201);
    expect(res.status).toBe(422);
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain("body.fields.policyNumber");
  });

  it("does not store a site name with a NUL in it", async () => {
    const buyer = agents.buyer;

    const res = await buyer
      .post("/api/sites")
      .send({ name: "North\u0000Bay plant", addressLine: "400 Millrace Road", postalCode: "60601" });
    const list = await buyer.get("/api/sites");

    expect(res.status).toBe(422);
    expect(res.body.error.fields[0].path).toBe("body.name");
    expect(JSON.stringify(list.body)).not.toContain("North");
  });
});

describe("a review reply", () => {
  it("refuses a NUL or a lone surrogate (422) and keeps line breaks and tabs", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "confirmed");
    const review = await world.shop.agent
      .post(`/api/work-orders/${id}/review`)
      .send({ stars: 5, body: "Spindle back within tolerance before second shift." });

    const nul = await world.provider.admin
      .post(`/api/reviews/${review.body.id}/reply`)
      .send({ body: "Thanks\u0000 for the call" });
    const surrogate = await world.provider.admin
      .post(`/api/reviews/${review.body.id}/reply`)
      .send({ body: "Thanks \udc00 for the call" });
    const fine = await world.provider.admin
      .post(`/api/reviews/${review.body.id}/reply`)
      .send({ body: "Thanks for the call.\r\n\tWe keep the spare on the van." });

    expect(review.status).toBe(201);
    expect(nul.status).toBe(422);
    expect(nul.body.error.fields[0].path).toBe("body.body");
    expect(surrogate.status).toBe(422);
    expect(fine.status).toBe(200);
    expect(fine.body.reply).toBe("Thanks for the call.\n\tWe keep the spare on the van.");
  });
});

describe("file names", () => {
  it("keeps a UTF-8 file name intact in storage, listings and the download's Content-Disposition", async () => {
    const name = "Zertifikat-Müller (Kopie).pdf";
    const { bytes, values } = await buildCertificatePdf({ seed: 4102 });

    const up = await provider.admin
      .post("/api/documents")
      .field("typeCode", "general_liability")
      .attach("file", Buffer.from(bytes), name);
    const submitted = await provider.admin.post("/api/credentials").send({
      documentId: up.body.document.id,
      typeCode: "general_liability",
      fields: certificateFields(values, "general_liability"),
    });
    const listed = await provider.admin.get("/api/credentials");
    const download = await provider.admin.get(`/api/documents/${up.body.document.id}/file`);

    expect(up.status).toBe(201);
    expect(up.body.document.name).toBe(name);
    expect(submitted.status).toBe(201);
    expect(listed.body.find((c: { id: number }) => c.id === submitted.body.id).documentName).toBe(name);
    expect(download.status).toBe(200);
    expect(download.headers["content-disposition"]).toBe(
      `attachment; filename="Zertifikat-M_ller (Kopie).pdf"; filename*=UTF-8''Zertifikat-M%C3%BCller%20%28Kopie%29.pdf`,
    );
  });
});
