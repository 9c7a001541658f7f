import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import type { Express } from "express";
import { buildTestApp, type TestApp } from "../support/test-app.ts";
import { signedInAgent } from "../support/build-provider.ts";
import { buildProvider } from "../support/build-provider.ts";
import { routeTable } from "../../server/http/route.ts";
import { roles, type Role } from "../../shared/accounts/schemas.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";

let t: TestApp;
const agents = {} as Record<Role, ReturnType<typeof request.agent>>;
beforeAll(async () => {
  t = buildTestApp();
  const provider = await buildProvider(t.app);
  agents.provider_admin = provider.admin;
  agents.technician = provider.tech;
  agents.reviewer = (await signedInAgent(t.app, "platform", "reviewer")).agent;
  agents.admin = (await signedInAgent(t.app, "platform", "admin")).agent;
  agents.buyer = (await signedInAgent(t.app, "shop", "buyer")).agent;
});
afterAll(() => t.close());

type Layer = { route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] } };

/** Every route Express actually serves, read from the app's own router. */
function servedRoutes(app: Express): string[] {
  const found: string[] = [];
  const walk = (stack: Layer[]) => {
    for (const layer of stack) {
      if (layer.route)
        for (const m of Object.keys(layer.route.methods)) found.push(`${m} ${layer.route.path}`);
      else if (layer.handle?.stack) walk(layer.handle.stack);
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack);
  return found.filter((r) => r.split(" ")[1]!.startsWith("/api"));
}

// Params are filled with ids that exist nowhere, so a permitted caller reaches the 404 of the ownership check.
const concretePath = (path: string) =>
  path
    .replace(/:code/g, "general_liability")
    .replace(/:page/g, "1")
    .replace(/:[A-Za-z]+/g, "99999999");

function call(
  agent: ReturnType<typeof request.agent> | ReturnType<typeof request>,
  method: string,
  path: string,
) {
  const r = (agent as unknown as Record<string, (p: string) => request.Test>)[method]!(path);
  return r.set(CSRF_HEADER, CSRF_HEADER_VALUE);
}

describe("authorisation matrix", () => {
  it("has a declared policy for every route the app serves", () => {
    const declared = new Set(routeTable.map((r) => `${r.method} ${r.path}`));

    const undeclared = servedRoutes(t.app).filter((r) => !declared.has(r));

    expect(routeTable.length).toBeGreaterThan(10);
    expect(undeclared).toEqual([]);
    for (const r of routeTable) expect(r.policy.name.length).toBeGreaterThan(0);
  });

  it("answers 401 to an anonymous caller of every route that is not public", async () => {
    const wrong: string[] = [];
    for (const r of routeTable) {
      if (r.policy.roles === "anyone") continue;
      const res = await call(request(t.app), r.method, concretePath(r.path));
      if (res.status !== 401) wrong.push(`${r.method} ${r.path} -> ${res.status}`);
    }

    expect(wrong).toEqual([]);
  });

  it("answers 403 to every role the policy leaves out, before reading the input", async () => {
    const wrong: string[] = [];
    let checked = 0;
    for (const r of routeTable) {
      if (r.policy.roles === "anyone" || r.policy.roles === "signed_in") continue;
      for (const role of roles) {
        if (r.policy.roles.includes(role)) continue;
        checked += 1;
        const res = await call(agents[role], r.method, concretePath(r.path)).send({});
        if (res.status !== 403) wrong.push(`${role} ${r.method} ${r.path} -> ${res.status}`);
      }
    }

    expect(checked).toBeGreaterThan(20);
    expect(wrong).toEqual([]);
  });

  it("lets every permitted role through the role check of each read-only route", async () => {
    const wrong: string[] = [];
    for (const r of routeTable.filter((x) => x.method === "get")) {
      const permitted =
        r.policy.roles === "anyone" || r.policy.roles === "signed_in" ? roles : r.policy.roles;
      for (const role of permitted) {
        const res = await call(agents[role], r.method, concretePath(r.path));
        if (res.status === 401 || res.status === 403 || res.status >= 500)
          wrong.push(`${role} ${r.method} ${r.path} -> ${res.status}`);
      }
    }

    expect(wrong).toEqual([]);
  });

  it("lets every role call each signed-in route, and answers a missing record id with 404", async () => {
    const wrong: string[] = [];
    const signedInRoutes = routeTable.filter((r) => r.policy.roles === "signed_in");
    for (const r of signedInRoutes) {
      for (const role of roles) {
        const res = await call(agents[role], r.method, concretePath(r.path)).send({});
        if (res.status === 401 || res.status === 403 || res.status >= 500)
          wrong.push(`${role} ${r.method} ${r.path} -> ${res.status}`);
        if (/:[A-Za-z]+Id\b/.test(r.path) && res.status !== 404)
          wrong.push(`${role} ${r.method} ${r.path} -> ${res.status} for a missing id`);
      }
    }

    expect(signedInRoutes.length).toBeGreaterThanOrEqual(4);
    expect(wrong).toEqual([]);
  });

  it("checks ownership on every route that names a record, unless its service scopes the record by the caller", () => {
    // Each of these looks its record up only among the caller's own rows (the cross-company walk proves it).
    // The directory page reads the shared visibility rule's facts in its own statement and answers a hidden
    // technician with the 404 of a missing id (tests/api/directory/technician-page.test.ts).
    const scopedByCaller = new Set([
      "post /api/notifications/:notificationId/read",
      "get /api/directory/technicians/:technicianId",
    ]);
    // Reviewers and admins work on every company's records by their role; only company roles need an ownership check.
    const platformOnly = (r: (typeof routeTable)[number]) =>
      Array.isArray(r.policy.roles) &&
      r.policy.roles.every((role) => role === "reviewer" || role === "admin");

    const unguarded = routeTable
      .filter((r) => /:[A-Za-z]+Id\b/.test(r.path) && !r.policy.owns && r.policy.roles !== "anyone")
      .filter((r) => !platformOnly(r))
      .map((r) => `${r.method} ${r.path}`)
      .filter((r) => !scopedByCaller.has(r));

    expect(unguarded).toEqual([]);
  });
});
