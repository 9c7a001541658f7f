import { describe, expect, it } from "vitest";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider, signedInAgent } from "../../support/build-provider.ts";
import { credentialTypeDtoSchema } from "../../../shared/credentials/credential-shapes.ts";

const t = useTestApp();

describe("the caution that comes with each credential type", () => {
  it("names the rule each safety card defers to, for the upload screens to show", async () => {
    const { admin } = await buildProvider(t.app);
    const res = await admin.get("/api/credential-types");
    expect(res.status).toBe(200);
    const cautionOf = (code: string): string | null =>
      (res.body as { code: string; caution: string | null }[]).find((type) => type.code === code)?.caution ??
      null;

    // NFPA 70E 110.6 (from memory): the employer decides who is qualified.
    expect(cautionOf("arc_flash")).toMatch(/employer decides.*NFPA 70E 110\.6/);
    // 29 CFR 1910.147: the host site's energy-control procedure applies.
    expect(cautionOf("lockout_tagout")).toMatch(/site's own lockout\/tagout procedure.*29 CFR 1910\.147/);
    // 29 CFR 1910.178(l): the evaluation is specific to the trucks and workplace.
    expect(cautionOf("powered_truck")).toMatch(/trucks and the workplace.*29 CFR 1910\.178\(l\)/);
    expect(cautionOf("machine_rigging")).toMatch(/training only.*lift plan/);
    expect(cautionOf("general_liability")).toMatch(/information only/);
    expect(cautionOf("workers_comp_exemption")).toMatch(/only the persons it names/);
  });

  it("comes back with an admin's edit of the type, as the catalogue lists it", async () => {
    const { agent: admin } = await signedInAgent(t.app, "platform", "admin");
    const listed = (await admin.get("/api/credential-types").expect(200)).body as { code: string }[];

    // Setting a type active that is active already changes nothing but answers the edited type.
    const res = await admin.patch("/api/admin/credential-types/arc_flash").send({ active: true });

    expect(res.status).toBe(200);
    expect(credentialTypeDtoSchema.strict().parse(res.body)).toEqual(
      listed.find((type) => type.code === "arc_flash"),
    );
  });
});
