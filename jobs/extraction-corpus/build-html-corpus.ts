import { chromium, type Browser } from "playwright-core";
import {
  buildSeededRandom,
  type SeededRandom,
} from "../../server/db/demo-scenario/documents/build-seeded-random.ts";
import { documentDateFormats, formatDocumentDate } from "../../shared/credentials/date-formats.ts";
import {
  COURSES,
  FIRMS,
  FIRST,
  LAST,
  coverageTruth,
  date,
  hashSplit,
  type CardTruth,
  type CertificateTruth,
  type CorpusDocument,
  type CoverageCode,
} from "./build-corpus.ts";

/**
 * A second, separately written producer for the corpus: HTML and CSS printed to PDF by Chromium. Only the invented
 * truth values are shared with the pdf-lib producer; markup, wordings, amount styles and page flow are its own, so
 * a reader tuned on one producer's habits shows it on the other. Certificates may run onto a second page with the
 * coverages continued there; cards are narrow enough that long course titles wrap.
 */

const CERT_LAYOUTS = ["boxed_table", "field_per_line", "two_column"] as const;
const CARD_LAYOUTS = ["wallet", "sentence", "grid"] as const;

const CERT_WORDS = [
  {
    insurer: "Insurer affording coverage",
    policy: "Policy number",
    eff: "Policy eff",
    exp: "Policy exp",
    ai: "Addl insd",
    wos: "Subr wvd",
  },
  {
    insurer: "Carrier",
    policy: "Policy No.",
    eff: "Effective date",
    exp: "Expiration date",
    ai: "Additional insured",
    wos: "Waiver of subrogation",
  },
  // Insurers listed once by letter on lines of their own; each coverage names only its letter.
  {
    insurer: "Insurer",
    policy: "Pol #",
    eff: "Eff date",
    exp: "Exp date",
    ai: "Additional insured",
    wos: "Waiver of subrogation",
    byLetter: true,
  },
  // Limits in a "(000s omitted)" table, short labels and marks as bare letters.
  {
    insurer: "Company affording coverage",
    policy: "Policy no",
    eff: "Policy effective",
    exp: "Policy expires",
    ai: "AI",
    wos: "WOS",
    thousands: true,
  },
];
const TITLES: Record<CoverageCode, string> = {
  general_liability: "Commercial General Liability",
  auto_liability: "Business Auto Liability",
  umbrella_liability: "Umbrella Liability",
  workers_comp: "Workers Compensation and Employers' Liability",
};
const LIMIT_LABELS: Record<string, string> = {
  eachOccurrence: "Each occurrence",
  generalAggregate: "General aggregate",
  combinedSingleLimit: "Combined single limit",
  umbrellaEachOccurrence: "Each occurrence",
  umbrellaAggregate: "Aggregate",
  employersLiabilityEachAccident: "E.L. each accident",
};
const CARD_WORDS = [
  {
    name: "Trainee",
    course: "Program",
    issue: "Issued",
    expiry: "Renew by",
    number: "ID No.",
    trainer: "Trainer",
  },
  {
    name: "Name",
    course: "Course",
    issue: "Completed on",
    expiry: "Valid through",
    number: "Card #",
    trainer: "Evaluated by",
  },
  // Each label on a line of its own with its value on the line below.
  {
    name: "Participant",
    course: "Training",
    issue: "Date of evaluation",
    expiry: "Re-evaluation due",
    number: "Certificate No.",
    trainer: "Instructor",
    below: true,
  },
];
/** Titles long enough to wrap on a wallet card, alongside the shared short ones. */
const LONG_COURSES = [
  "Machine Guarding, Lockout and Safe Setup for CNC Turning and Milling Centers",
  "Qualified Person Electrical Safety for Machine Tool Control Cabinets",
];

const escape = (text: string) =>
  text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

function money(random: SeededRandom, amount: number, thousands = false): string {
  if (thousands) return (amount / 1000).toLocaleString("en-US");
  const millions = amount / 1_000_000;
  const styles = [
    `$${amount.toLocaleString("en-US")}`,
    `$ ${amount.toLocaleString("en-US")}`,
    amount.toLocaleString("en-US"),
    ...(Number.isInteger(millions) ? [`$${millions}M`, `${millions}MM`] : []),
  ];
  return random.pick(styles);
}

const BASE_CSS = `
  body { font-family: FONT; font-size: SIZEpt; margin: 0; color: #111; }
  h1 { font-size: 14pt; margin: 0 0 10pt; }
  h2 { font-size: 10pt; margin: 12pt 0 4pt; text-transform: uppercase; }
  .page-break { break-before: page; }
  table.boxed { border-collapse: collapse; width: 100%; }
  table.boxed td, table.boxed th { border: 1px solid #333; padding: 3pt 5pt; vertical-align: top; text-align: left; }
  .line { margin: 2pt 0; }
  .cols { display: grid; grid-template-columns: 1fr 1fr; column-gap: 28pt; }
  .pair { display: grid; grid-template-columns: 42% 58%; margin: 2pt 0; }
`;

function certificateTruth(random: SeededRandom, family: string): CertificateTruth {
  const codes = (
    ["general_liability", "auto_liability", "umbrella_liability", "workers_comp"] as const
  ).filter(() => random.next() < 0.85);
  return {
    kind: "certificate",
    family,
    namedInsured: `${random.pick(FIRMS)} Spindle Repair ${random.pick(["LLC", "Inc."])}`,
    certificateHolder: `${random.pick(FIRMS)} Tool & Die ${random.pick(["Co.", "LLC"])}`,
    coverages: (codes.length ? codes : (["auto_liability"] as const)).map((code) =>
      coverageTruth(random, code),
    ),
  };
}

function certificateHtml(seed: number, layout: (typeof CERT_LAYOUTS)[number], wording: number) {
  const random = buildSeededRandom(seed);
  const truth = certificateTruth(random, `html-certificate/${layout}/${wording}`);
  const words = CERT_WORDS[wording]!;
  const format = random.pick(documentDateFormats);
  const fmt = (iso: string) => escape(formatDocumentDate(iso, format));
  const mark = (on: boolean) => (random.bool() ? (on ? "Y" : "N") : on ? "Yes" : "No");
  // Half of the certificates push the later coverages onto page 2 under a "continued" heading.
  const breakAfter =
    truth.coverages.length > 1 && random.bool() ? random.int(1, truth.coverages.length - 1) : -1;
  const letters = truth.coverages.map((_, index) => "ABCDEF"[index]!);
  const blocks = truth.coverages.map((c, index) => {
    const rows: Array<[string, string]> = [
      [words.insurer, "byLetter" in words ? letters[index]! : `${escape(c.insurerName)}, NAIC ${c.naic}`],
      [words.policy, escape(c.policyNumber)],
      [words.eff, fmt(c.effectiveDate)],
      [words.exp, fmt(c.expirationDate)],
      ...Object.entries(c.limits).map(([k, v]): [string, string] => [
        LIMIT_LABELS[k]!,
        money(random, v, "thousands" in words),
      ]),
      [words.ai, mark(c.additionalInsured)],
      [words.wos, mark(c.waiverOfSubrogation)],
    ];
    const body =
      layout === "boxed_table"
        ? `<table class="boxed">${rows.map(([l, v]) => `<tr><th>${l}</th><td>${v}</td></tr>`).join("")}</table>`
        : layout === "field_per_line"
          ? rows.map(([l, v]) => `<div class="line">${l}: ${v}</div>`).join("")
          : rows.map(([l, v]) => `<div class="pair"><span>${l}</span><span>${v}</span></div>`).join("");
    const continued =
      index === breakAfter ? `<div class="page-break"></div><h1>Coverages (continued)</h1>` : "";
    const omitted = "thousands" in words ? `<div class="line">Limits (000s omitted)</div>` : "";
    return `${continued}<section><h2>${TITLES[c.code]}</h2>${omitted}${body}</section>`;
  });
  const insurerLines =
    "byLetter" in words
      ? truth.coverages
          .map(
            (c, i) =>
              `<div class="line">Insurer ${letters[i]}: ${escape(c.insurerName)} NAIC ${c.naic}</div>`,
          )
          .join("")
      : "";
  const street = `${random.int(100, 9999)} ${random.pick(["Gantry", "Collet", "Tailstock"])} Avenue`;
  const html = `<!doctype html><html><head><style>${BASE_CSS.replace("FONT", random.pick(["Arial, sans-serif", "Georgia, serif", "'DejaVu Sans', sans-serif"])).replace("SIZE", String(random.pick([9, 10])))}</style></head><body>
    <h1>Certificate of Liability Insurance</h1>
    <div class="line">Insured</div><div class="line">${escape(truth.namedInsured)}</div>
    <div class="line">${street}</div><div class="line">Kestrel Falls, IN 4${random.int(6000, 7999)}</div>
    ${insurerLines}
    ${layout === "two_column" ? `<div class="cols">${blocks.join("")}</div>` : blocks.join("")}
    <h2>Description of operations</h2><div class="line">Repair and calibration of CNC machine tools at the holder's plant.</div>
    <h2>Certificate holder</h2><div class="line">${escape(truth.certificateHolder)}</div>
    <div class="line">${random.int(10, 999)} Arbor Press Lane, Wickham Ford, MI 4${random.int(8000, 9999)}</div>
  </body></html>`;
  return { html, truth, size: { width: "8.5in", height: "11in" } };
}

function cardHtml(seed: number, layout: (typeof CARD_LAYOUTS)[number], wording: number) {
  const random = buildSeededRandom(seed);
  const words = CARD_WORDS[wording]!;
  const issueDate = date(random, 2025);
  const truth: CardTruth = {
    kind: "card",
    family: `html-card/${layout}/${wording}`,
    holderName: `${random.pick(FIRST)} ${random.pick(LAST)}`,
    course: random.pick([...COURSES, ...LONG_COURSES]),
    issueDate,
    expiryDate: `${Number(issueDate.slice(0, 4)) + random.int(1, 3)}${issueDate.slice(4)}`,
    cardNumber: `${random.pick(["QW", "MT"])}-${random.int(10000, 99999)}`,
    trainer: `${random.pick(FIRST)} ${random.pick(LAST)}`,
  };
  const format = random.pick(documentDateFormats);
  const fmt = (iso: string) => escape(formatDocumentDate(iso, format));
  const fields: Array<[string, string]> = [
    [words.name, escape(truth.holderName)],
    [words.course, escape(truth.course)],
    [words.issue, fmt(truth.issueDate)],
    [words.expiry, fmt(truth.expiryDate)],
    [words.number, truth.cardNumber],
    [words.trainer, escape(truth.trainer)],
  ];
  const body =
    layout === "wallet" && "below" in words
      ? fields.map(([l, v]) => `<div class="line"><b>${l}</b></div><div class="line">${v}</div>`).join("")
      : layout === "wallet"
        ? fields.map(([l, v]) => `<div class="line"><b>${l}:</b> ${v}</div>`).join("")
        : layout === "grid"
          ? fields.map(([l, v]) => `<div class="pair"><span>${l}</span><span>${v}</span></div>`).join("")
          : `<p>This certifies that ${escape(truth.holderName)} has completed ${escape(truth.course)}.</p>` +
            fields
              .slice(2)
              .map(([l, v]) => `<div class="line">${l} ${v}</div>`)
              .join("");
  const html = `<!doctype html><html><head><style>${BASE_CSS.replace("FONT", random.pick(["Arial, sans-serif", "Georgia, serif"])).replace("SIZE", "8")} body { padding: 10pt 12pt; }</style></head><body>
    <h1>${random.pick(["Training Completion Card", "Qualified Operator"])}</h1>${body}</body></html>`;
  return { html, truth, size: { width: "3.5in", height: "2.6in" } };
}

async function printPdf(browser: Browser, html: string, size: { width: string; height: string }) {
  const page = await browser.newPage();
  try {
    await page.setContent(html, { waitUntil: "load" });
    return new Uint8Array(
      await page.pdf({
        ...size,
        printBackground: true,
        margin: { top: "0.4in", bottom: "0.4in", left: "0.4in", right: "0.4in" },
      }),
    );
  } finally {
    await page.close();
  }
}

/** The Chromium-printed part of the corpus; split by the same hash of each document's id as the pdf-lib part. */
export async function buildHtmlCorpus(perFamily = 3): Promise<CorpusDocument[]> {
  const browser = await chromium.launch({
    executablePath: "/usr/bin/chromium",
    headless: true,
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
  const documents: CorpusDocument[] = [];
  let seed = 41000;
  try {
    const push = async (made: {
      html: string;
      truth: CertificateTruth | CardTruth;
      size: { width: string; height: string };
    }) => {
      const id = `${made.truth.family}/${seed}`;
      const bytes = await printPdf(browser, made.html, made.size);
      documents.push({ id, seed, split: hashSplit(id), generator: "chromium", bytes, truth: made.truth });
    };
    for (const layout of CERT_LAYOUTS)
      for (let wording = 0; wording < CERT_WORDS.length; wording += 1)
        for (let n = 0; n < perFamily; n += 1) await push(certificateHtml((seed += 1), layout, wording));
    for (const layout of CARD_LAYOUTS)
      for (let wording = 0; wording < CARD_WORDS.length; wording += 1)
        for (let n = 0; n < perFamily; n += 1) await push(cardHtml((seed += 1), layout, wording));
  } finally {
    await browser.close();
  }
  return documents;
}
