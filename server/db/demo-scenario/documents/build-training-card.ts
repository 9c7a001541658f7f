import { PDFDocument, StandardFonts, rgb } from "pdf-lib";
import { formatDocumentDate, type DocumentDateFormat } from "../../../../shared/credentials/date-formats.ts";
import { buildSeededRandom } from "./build-seeded-random.ts";

export interface TrainingCardValues {
  provider: string;
  holderName: string;
  course: string;
  issueDate: string;
  expiryDate?: string;
  cardNumber: string;
  trainer: string;
  dateFormat: DocumentDateFormat;
  /** Machine-builder training adds these three lines. */
  oem?: { builder: string; controlFamily: string; level: 1 | 2 | 3 };
}

const FIRST = ["Jordan", "Marisol", "Tobias", "Anneke", "Desmond", "Priya", "Casimir", "Leontine"];
const LAST = ["Vasquez-Lindqvist", "Okafor", "Brandt", "Halloran", "Szabo", "Thorne", "Ruiz", "Whitcombe"];
const COURSES = [
  ["Lockout/Tagout Refresher", 1],
  ["Arc Flash Awareness (NFPA 70E)", 3],
  ["First Aid and CPR", 2],
  ["Powered Industrial Truck Operator", 3],
] as const;
const PROVIDERS = [
  "Northfield Safety Institute",
  "Bramblecote Training Center",
  "Ridgeway Industrial Academy",
];
const BUILDERS = ["Torsvik Machine Works", "Halden Axis Systems", "Corvane Machine Tool"];
const CONTROLS = ["Veltrion 500", "Quintar NX", "Brisel 9"];

/** Random but repeatable card values; the same seed gives the same card. */
export function randomTrainingCardValues(
  seed: number,
  kind: "training" | "oem" = "training",
): TrainingCardValues {
  const random = buildSeededRandom(seed);
  const [course, years] = random.pick(COURSES);
  const year = random.int(2023, 2026);
  const issueDate = `${year}-${String(random.int(1, 12)).padStart(2, "0")}-${String(random.int(1, 28)).padStart(2, "0")}`;
  return {
    provider: random.pick(PROVIDERS),
    holderName: `${random.pick(FIRST)} ${random.pick(LAST)}`,
    course: kind === "oem" ? "Spindle and Axis Service" : course,
    issueDate,
    expiryDate: `${year + years}${issueDate.slice(4)}`,
    cardNumber: `${random.pick(["LT", "AF", "ST"])}-${random.int(10_000, 99_999)}-${random.int(1, 9)}`,
    trainer: `${random.pick(FIRST)} ${random.pick(LAST)}`,
    dateFormat: random.bool() ? "MM/DD/YYYY" : "YYYY-MM-DD",
    ...(kind === "oem"
      ? {
          oem: {
            builder: random.pick(BUILDERS),
            controlFamily: random.pick(CONTROLS),
            level: random.pick([1, 2, 3] as const),
          },
        }
      : {}),
  };
}

/** A wallet card (3.5 x 2 inches) as a PDF, with the values written returned for comparison. */
export async function buildTrainingCardPdf(
  overrides: Partial<TrainingCardValues> & { seed?: number; kind?: "training" | "oem" } = {},
) {
  const { seed = 1, kind = "training", ...rest } = overrides;
  const values: TrainingCardValues = { ...randomTrainingCardValues(seed, kind), ...rest };
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  const bold = await doc.embedFont(StandardFonts.HelveticaBold);
  const height = values.oem ? 200 : 160;
  const page = doc.addPage([300, height]);
  page.drawRectangle({
    x: 4,
    y: 4,
    width: 292,
    height: height - 8,
    borderColor: rgb(0.1, 0.2, 0.45),
    borderWidth: 1.5,
  });
  page.drawText(values.provider.toUpperCase(), {
    x: 14,
    y: height - 22,
    size: 9,
    font: bold,
    color: rgb(0.1, 0.2, 0.45),
  });
  page.drawText(values.oem ? "Machine Builder Training Record" : "Safety Training Completion Card", {
    x: 14,
    y: height - 34,
    size: 7,
    font,
  });
  const date = (iso: string) => formatDocumentDate(iso, values.dateFormat);
  const lines: string[] = [
    `Name: ${values.holderName}`,
    `Course: ${values.course}`,
    ...(values.oem
      ? [
          `Builder: ${values.oem.builder}`,
          `Control: ${values.oem.controlFamily}`,
          `Level: ${values.oem.level}`,
        ]
      : []),
    `Issued: ${date(values.issueDate)}${values.expiryDate ? `      Expires: ${date(values.expiryDate)}` : ""}`,
    `Card No: ${values.cardNumber}`,
    `Trainer: ${values.trainer}`,
  ];
  lines.forEach((line, i) => page.drawText(line, { x: 14, y: height - 54 - i * 14, size: 8.5, font }));
  return { bytes: new Uint8Array(await doc.save()), values };
}
