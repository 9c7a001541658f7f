import type { MachineTechnology } from "../../../shared/technicians/schemas.ts";
import { demoBuilders } from "./machine-builders.ts";

export interface DemoTechnician {
  key: string;
  companyKey: string;
  name: string;
  email: string;
  phone: string;
  technologies: MachineTechnology[];
  controlFamilies: string[];
  /** Real ZIP codes near the company's city, so directory distances make sense. */
  postalCode: string;
  serviceRadiusKm: number;
  hourlyRateCents: number;
  travelRateCents: number;
  mileageRateCents: number;
}

const { vantor, halden, orrin, strell } = demoBuilders;

// Invented people; 555-01xx numbers are reserved for fiction.
export const demoTechnicians: DemoTechnician[] = [
  {
    key: "tobias",
    companyKey: "kestrel",
    name: "Tobias Wren",
    email: "tobias@kestrel-ridge.test",
    phone: "(312) 555-0141",
    technologies: ["mill", "mill_turn"],
    controlFamilies: [vantor.controls.mill, halden.controls.millTurn],
    postalCode: "60614",
    serviceRadiusKm: 160,
    hourlyRateCents: 145_00,
    travelRateCents: 95_00,
    mileageRateCents: 70,
  },
  {
    key: "noor",
    companyKey: "kestrel",
    name: "Noor Castellane",
    email: "noor@kestrel-ridge.test",
    phone: "(630) 555-0117",
    technologies: ["lathe", "mill_turn"],
    controlFamilies: [vantor.controls.lathe],
    postalCode: "60440",
    serviceRadiusKm: 120,
    hourlyRateCents: 135_00,
    travelRateCents: 90_00,
    mileageRateCents: 70,
  },
  {
    key: "emeric",
    companyKey: "kestrel",
    name: "Emeric Dunleavy",
    email: "emeric@kestrel-ridge.test",
    phone: "(630) 555-0163",
    technologies: ["wire_edm", "sinker_edm"],
    controlFamilies: [strell.controls.edm],
    postalCode: "60185",
    serviceRadiusKm: 250,
    hourlyRateCents: 165_00,
    travelRateCents: 105_00,
    mileageRateCents: 72,
  },
  {
    key: "ysolde",
    companyKey: "kestrel",
    name: "Ysolde Marchetti",
    email: "ysolde@kestrel-ridge.test",
    phone: "(847) 555-0188",
    technologies: ["grinder", "mill"],
    controlFamilies: [vantor.controls.mill],
    postalCode: "60047",
    serviceRadiusKm: 90,
    hourlyRateCents: 125_00,
    travelRateCents: 85_00,
    mileageRateCents: 67,
  },
  {
    key: "henrik",
    companyKey: "bluewater",
    name: "Henrik Solberg-Paz",
    email: "henrik@bluewater-spindle.test",
    phone: "(262) 555-0129",
    technologies: ["mill", "lathe"],
    controlFamilies: [vantor.controls.mill, vantor.controls.lathe],
    postalCode: "53186",
    serviceRadiusKm: 200,
    hourlyRateCents: 150_00,
    travelRateCents: 100_00,
    mileageRateCents: 70,
  },
  {
    key: "oona",
    companyKey: "bluewater",
    name: "Oona Trevethan",
    email: "oona@bluewater-spindle.test",
    phone: "(262) 555-0174",
    technologies: ["laser", "waterjet"],
    controlFamilies: [orrin.controls.laser],
    postalCode: "53045",
    serviceRadiusKm: 300,
    hourlyRateCents: 175_00,
    travelRateCents: 110_00,
    mileageRateCents: 73,
  },
  {
    key: "matthias",
    companyKey: "bluewater",
    name: "Matthias Kellerup",
    email: "matthias@bluewater-spindle.test",
    phone: "(414) 555-0102",
    technologies: ["press_brake", "laser"],
    controlFamilies: [orrin.controls.laser],
    postalCode: "53132",
    serviceRadiusKm: 150,
    hourlyRateCents: 130_00,
    travelRateCents: 90_00,
    mileageRateCents: 68,
  },
  {
    key: "saoirse",
    companyKey: "copperline",
    name: "Saoirse Vandeleur",
    email: "saoirse@copperline-field.test",
    phone: "(317) 555-0136",
    technologies: ["mill", "lathe"],
    controlFamilies: [vantor.controls.mill, vantor.controls.lathe],
    postalCode: "46077",
    serviceRadiusKm: 220,
    hourlyRateCents: 140_00,
    travelRateCents: 95_00,
    mileageRateCents: 70,
  },
  {
    key: "rafferty",
    companyKey: "copperline",
    name: "Rafferty Onwuachi",
    email: "rafferty@copperline-field.test",
    phone: "(317) 555-0158",
    technologies: ["grinder", "wire_edm"],
    controlFamilies: [strell.controls.edm],
    postalCode: "46143",
    serviceRadiusKm: 80,
    hourlyRateCents: 120_00,
    travelRateCents: 85_00,
    mileageRateCents: 65,
  },
  {
    key: "lucinda",
    companyKey: "copperline",
    name: "Lucinda Harrowgate",
    email: "lucinda@copperline-field.test",
    phone: "(317) 555-0191",
    technologies: ["mill_turn", "mill"],
    controlFamilies: [halden.controls.millTurn],
    postalCode: "46060",
    serviceRadiusKm: 180,
    hourlyRateCents: 155_00,
    travelRateCents: 100_00,
    mileageRateCents: 70,
  },
];
