import type { CompanyKind, Role } from "../../../shared/accounts/schemas.ts";

// An invented world: every company, person and street here is made up. ZIP codes are real so the
// offline postal-code data can place them.
export interface DemoCompany {
  key: string;
  name: string;
  kind: CompanyKind;
  addressLine: string;
  postalCode: string;
  timeZone: string;
  users: { name: string; email: string; role: Role; technicianKey?: string }[];
}

export const demoCompanies: DemoCompany[] = [
  {
    key: "platform",
    name: "Clearbench Operations",
    kind: "platform",
    addressLine: "18 Lantern Court",
    postalCode: "60601",
    timeZone: "America/Chicago",
    users: [
      { name: "Ida Fenwright", email: "admin@clearbench.test", role: "admin" },
      { name: "Roland Achterberg", email: "reviewer@clearbench.test", role: "reviewer" },
    ],
  },
  {
    key: "kestrel",
    name: "Kestrel Ridge Machine Service LLC",
    kind: "service",
    addressLine: "2240 Tallgrass Way",
    postalCode: "60601",
    timeZone: "America/Chicago",
    users: [
      { name: "Marisol Quennell", email: "office@kestrel-ridge.test", role: "provider_admin" },
      {
        name: "Tobias Wren",
        email: "tobias@kestrel-ridge.test",
        role: "technician",
        technicianKey: "tobias",
      },
    ],
  },
  {
    key: "bluewater",
    name: "Bluewater Spindle Works Inc.",
    kind: "service",
    addressLine: "77 Harbor Lathe Street",
    postalCode: "53202",
    timeZone: "America/Chicago",
    users: [
      { name: "Delphine Okafor-Strand", email: "office@bluewater-spindle.test", role: "provider_admin" },
      {
        name: "Henrik Solberg-Paz",
        email: "henrik@bluewater-spindle.test",
        role: "technician",
        technicianKey: "henrik",
      },
    ],
  },
  {
    key: "copperline",
    name: "Copperline Field Technicians Co.",
    kind: "service",
    addressLine: "905 Foundry Row",
    postalCode: "46204",
    timeZone: "America/Indiana/Indianapolis",
    users: [
      { name: "Augustin Behrle", email: "office@copperline-field.test", role: "provider_admin" },
      {
        name: "Saoirse Vandeleur",
        email: "saoirse@copperline-field.test",
        role: "technician",
        technicianKey: "saoirse",
      },
    ],
  },
  {
    key: "marlow",
    name: "Marlow Precision Components",
    kind: "shop",
    addressLine: "3100 Quarry Bend Road",
    postalCode: "61101",
    timeZone: "America/Chicago",
    users: [{ name: "Priya Vandermolen", email: "buyer@marlow-precision.test", role: "buyer" }],
  },
  {
    key: "tamsin",
    name: "Tamsin Gear & Shaft",
    kind: "shop",
    addressLine: "48 Millrace Avenue",
    postalCode: "49503",
    timeZone: "America/Detroit",
    users: [{ name: "Casimir Ollendorf", email: "buyer@tamsin-gear.test", role: "buyer" }],
  },
];
