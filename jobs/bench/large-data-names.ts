// Invented names for the large data set: no real company, person or machine builder.
export const FIRST_NAMES = [
  "Arlo",
  "Bexley",
  "Calder",
  "Dacey",
  "Emrys",
  "Fenna",
  "Garrick",
  "Halsey",
  "Ines",
  "Joren",
  "Kestra",
  "Lorcan",
  "Maelis",
  "Nevin",
  "Orla",
  "Perrin",
  "Quill",
  "Rowan",
  "Saoirse",
  "Tamsin",
  "Ulric",
  "Vesna",
  "Wren",
  "Yorick",
  "Zeno",
  "Ambrose",
  "Brielle",
  "Corwin",
  "Delphine",
  "Evander",
  "Fiora",
  "Gideon",
  "Hollis",
  "Isolde",
  "Jasper",
  "Kerensa",
  "Linden",
  "Marisol",
  "Nolan",
  "Odessa",
];

export const LAST_NAMES = [
  "Ashdown",
  "Brightwater",
  "Caskey",
  "Dunmore",
  "Elsworth",
  "Fairbairn",
  "Greythorn",
  "Holloway",
  "Ingleby",
  "Jarrow",
  "Kettering",
  "Larchmont",
  "Merriweather",
  "Northcote",
  "Oakhurst",
  "Pemberton",
  "Quarrington",
  "Ravensworth",
  "Stanhope",
  "Thistlewood",
  "Underhill",
  "Vantongeren",
  "Whitcombe",
  "Yardley",
  "Zellweger",
  "Amberley",
  "Blackmere",
  "Coldridge",
  "Dunstable",
  "Everleigh",
];

export const COMPANY_WORDS = [
  "Kestrel",
  "Bluewater",
  "Copperline",
  "Ironbark",
  "Stillwater",
  "Granite",
  "Northfield",
  "Rookhallow",
  "Silverleaf",
  "Thornbury",
  "Harrow",
  "Wexford",
  "Larkspur",
  "Brambleton",
  "Cinderhill",
  "Driftwood",
  "Emberly",
  "Foxmoor",
  "Glenhaven",
  "Hollowmere",
];

export const SERVICE_SUFFIXES = [
  "Machine Service LLC",
  "Spindle Works Inc.",
  "Field Technicians Co.",
  "CNC Repair LLC",
  "Machine Care Inc.",
  "Axis Service Co.",
];

export const SHOP_SUFFIXES = [
  "Precision Components",
  "Gear & Shaft",
  "Tool & Die",
  "Machining Inc.",
  "Fabrication LLC",
];

/** Invented builders, each with its control families (the directory's OEM filter compares these). */
export const BUILDERS: { name: string; controls: string[] }[] = [
  { name: "Vantor Machine Works", controls: ["Kestle 40", "Kestle 60L"] },
  { name: "Halden Axis Systems", controls: ["Halden HX-7"] },
  { name: "Orrin & Vale Toolworks", controls: ["Linea 9"] },
  { name: "Strell Spark Systems", controls: ["Spark 5"] },
  { name: "Corvane Dynamics", controls: ["CD-300", "CD-500"] },
  { name: "Pellward Industries", controls: ["PW Series 8"] },
];

export const INSURERS = [
  "Granite Ledger Mutual",
  "Bluestem Casualty Company",
  "Ironvale Indemnity Corp.",
  "Tallgrass Assurance Company",
];

/** A SQL array literal of text values (the names above contain no single quotes but one ampersand). */
export function sqlTextArray(values: readonly string[]): string {
  return `ARRAY[${values.map((v) => `'${v.replace(/'/g, "''")}'`).join(",")}]::text[]`;
}
