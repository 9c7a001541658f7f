import { Technician } from "../../server/technicians/model.ts";
import { User } from "../../server/accounts/model.ts";
import { agentFor, signedInAs } from "./test-app.ts";
import { buildCompany, TEST_PASSWORD } from "./build-company.ts";
import type { Express } from "express";

/** A service company with its admin, one technician (with a sign-in) and signed-in agents for both. */
export async function buildProvider(app: Express, name?: string) {
  const { company, users, tag } = await buildCompany("service", ["provider_admin"], name ? { name } : {});
  const technician = await Technician.create({
    companyId: company.id,
    name: `Rosalind Tennant-${tag}`,
    email: null,
    phone: null,
    technologies: ["mill"],
    controlFamilies: ["Kestle 40"],
    postalCode: "60601",
    latitude: 41.8858,
    longitude: -87.6181,
    serviceRadiusKm: 150,
    hourlyRateCents: 14000,
    travelRateCents: 10000,
  });
  const techUser = await User.create({
    companyId: company.id,
    email: `tech-${tag}@example.test`,
    name: technician.name,
    role: "technician",
    passwordHash: users.provider_admin!.passwordHash,
    technicianId: technician.id,
  });
  const admin = await signedInAs(app, users.provider_admin!.email);
  const tech = agentFor(app);
  await tech.post("/api/auth/sign-in").send({ email: techUser.email, password: TEST_PASSWORD }).expect(200);
  return { company, technician, admin, tech, adminUser: users.provider_admin!, techUser };
}

export async function signedInAgent(
  app: Express,
  kind: "platform" | "shop",
  role: "reviewer" | "admin" | "buyer",
) {
  const { users, company } = await buildCompany(kind, [role]);
  const agent = await signedInAs(app, users[role]!.email);
  return { agent, user: users[role]!, company };
}
