import { PDFDocument } from "pdf-lib";
import { extractDocument } from "../../server/credentials/extraction/extract-document.ts";
import { proposeCoverages, proposeFields } from "../../shared/credentials/extract-fields.ts";
import { buildScannedPdf } from "../../tests/fixtures/build-scanned-pdf.ts";
import { buildCorpus, type CardTruth, type CertificateTruth } from "./build-corpus.ts";
import { buildHtmlCorpus } from "./build-html-corpus.ts";
import { photoStyle, photographPage } from "./photograph.ts";

/**
 * Field accuracy of the reader on the corpus, per field kind, for the text layer and (with --ocr) the same documents
 * scanned. Reports the held-out split unless --split tune is given; failures are listed for the tune split only, so
 * the held-out part is never looked at field by field while tuning. A value from the wrong coverage, or any value
 * that differs from the printed one, counts as wrong; an empty field counts as not right.
 */
type Kind =
  | "names"
  | "insurers"
  | "naic"
  | "policy_numbers"
  | "dates"
  | "limits"
  | "marks"
  | "card_numbers"
  | "courses";
type Tally = Record<Kind, { right: number; wrong: number; other: number; empty: number }>;

const say = (text: string) => process.stdout.write(`${text}\n`);
const args = process.argv.slice(2);
const split = args.includes("--split") ? args[args.indexOf("--split") + 1] : "held_out";
const withOcr = args.includes("--ocr");
// OCR reads about a second a page, so --sample N reads every Nth document on the OCR paths (the text path reads all).
const sample = args.includes("--sample") ? Number(args[args.indexOf("--sample") + 1]) : 1;

const emptyTally = (): Tally =>
  Object.fromEntries(
    [
      "names",
      "insurers",
      "naic",
      "policy_numbers",
      "dates",
      "limits",
      "marks",
      "card_numbers",
      "courses",
    ].map((k) => [k, { right: 0, wrong: 0, other: 0, empty: 0 }]),
  ) as Tally;

const failures: string[] = [];
// Which path is being scored, so each listed miss says whether the text layer, the scan or the photo missed it.
let scoredPath = "text";
/**
 * `others` holds the same field's printed values on the document's other coverages: a value taken from one of them
 * is the worst miss (it looks right to a reader), so it is counted on its own and not as a plain wrong value.
 */
function count(
  tally: Tally,
  kind: Kind,
  expected: unknown,
  got: unknown,
  where: string,
  others: unknown[] = [],
) {
  if (got === undefined || got === null || got === "") tally[kind].empty += 1;
  else if (got === expected) tally[kind].right += 1;
  else if (others.includes(got)) tally[kind].other += 1;
  else tally[kind].wrong += 1;
  if (got !== expected) failures.push(`${scoredPath} ${where}: ${String(got)} != ${String(expected)}`);
}

function scoreCertificate(tally: Tally, truth: CertificateTruth, text: string, id: string) {
  const { coverages, parties } = proposeCoverages(text);
  count(tally, "names", truth.namedInsured, parties.namedInsured, `${id} namedInsured`);
  count(tally, "names", truth.certificateHolder, parties.certificateHolder, `${id} certificateHolder`);
  for (const coverage of truth.coverages) {
    const read = coverages.find((c) => c.typeCode === coverage.code)?.proposal.fields ?? {};
    const at = `${id} ${coverage.code}`;
    const rest = truth.coverages.filter((c) => c !== coverage);
    // Marks are yes/no and limits are round millions, so another coverage's value cannot be told from a plain miss.
    const of = <T>(pick: (c: (typeof rest)[number]) => T) => rest.map(pick);
    count(
      tally,
      "insurers",
      coverage.insurerName,
      read.insurerName,
      `${at} insurer`,
      of((c) => c.insurerName),
    );
    count(
      tally,
      "naic",
      coverage.naic,
      read.naic,
      `${at} naic`,
      of((c) => c.naic),
    );
    count(
      tally,
      "policy_numbers",
      coverage.policyNumber,
      read.policyNumber,
      `${at} policy`,
      of((c) => c.policyNumber),
    );
    count(
      tally,
      "dates",
      coverage.effectiveDate,
      read.effectiveDate,
      `${at} effective`,
      of((c) => c.effectiveDate),
    );
    count(
      tally,
      "dates",
      coverage.expirationDate,
      read.expirationDate,
      `${at} expiration`,
      of((c) => c.expirationDate),
    );
    for (const [name, amount] of Object.entries(coverage.limits))
      count(
        tally,
        "limits",
        amount,
        (read.limits as Record<string, number> | undefined)?.[name],
        `${at} ${name}`,
      );
    count(tally, "marks", coverage.additionalInsured, read.additionalInsured, `${at} additionalInsured`);
    count(tally, "marks", coverage.waiverOfSubrogation, read.waiverOfSubrogation, `${at} waiver`);
  }
}

function scoreCard(tally: Tally, truth: CardTruth, text: string, id: string) {
  const read = proposeFields("lockout_tagout", "training", text).fields;
  count(tally, "names", truth.holderName, read.holderName, `${id} holder`);
  count(tally, "courses", truth.course, read.course, `${id} course`);
  count(tally, "dates", truth.issueDate, read.issueDate, `${id} issue`);
  count(tally, "dates", truth.expiryDate, read.expiryDate, `${id} expiry`);
  count(tally, "card_numbers", truth.cardNumber, read.cardNumber, `${id} number`);
  count(tally, "names", truth.trainer, read.trainer, `${id} trainer`);
}

function print(label: string, tally: Tally, docs: number, msPerPage: number[]) {
  const rows = Object.entries(tally).filter(([, t]) => t.right + t.wrong + t.other + t.empty > 0);
  const total = rows.reduce((s, [, t]) => s + t.right + t.wrong + t.other + t.empty, 0);
  const right = rows.reduce((s, [, t]) => s + t.right, 0);
  const other = rows.reduce((s, [, t]) => s + t.other, 0);
  const sorted = [...msPerPage].sort((a, b) => a - b);
  const p95 = sorted[Math.min(sorted.length - 1, Math.floor(sorted.length * 0.95))] ?? 0;
  say(
    `\n${label}: ${docs} documents, ${right}/${total} fields right (${((100 * right) / total).toFixed(1)}%), ${other} from another coverage, read p95 ${p95.toFixed(0)} ms/page`,
  );
  say(
    "| field kind | right | wrong | from another coverage | left empty | accuracy |\n|---|---:|---:|---:|---:|---:|",
  );
  for (const [kind, t] of rows) {
    const n = t.right + t.wrong + t.other + t.empty;
    say(
      `| ${kind} | ${t.right} | ${t.wrong} | ${t.other} | ${t.empty} | ${((100 * t.right) / n).toFixed(1)}% |`,
    );
  }
}

const corpus = [...(await buildCorpus()), ...(await buildHtmlCorpus())].filter((doc) => doc.split === split);
const families = new Set(corpus.map((doc) => doc.truth.family));
const pages = new Map<string, number>();
for (const doc of corpus) pages.set(doc.id, (await PDFDocument.load(doc.bytes)).getPageCount());
const twoPage = [...pages.values()].filter((n) => n > 1).length;
say(
  `Corpus split "${split}": ${corpus.length} documents from ${families.size} families, ${twoPage} of two pages`,
);
for (const path of withOcr ? (["text", "ocr", "photo"] as const) : (["text"] as const)) {
  scoredPath = path;
  const all = { tally: emptyTally(), times: [] as number[], docs: 0 };
  const byGenerator = new Map<string, typeof all>();
  for (const [index, doc] of corpus.entries()) {
    if (path !== "text" && index % sample !== 0) continue;
    // A photo shows one page: two-page certificates are scanned, not photographed.
    if (path === "photo" && pages.get(doc.id)! > 1) continue;
    const mine = byGenerator.get(doc.generator) ?? { tally: emptyTally(), times: [], docs: 0 };
    byGenerator.set(doc.generator, mine);
    const bytes =
      path === "ocr"
        ? await buildScannedPdf(doc.bytes, 200)
        : path === "photo"
          ? await photographPage(doc.bytes, photoStyle(doc.seed))
          : doc.bytes;
    const started = performance.now();
    // A reading that times out or fails leaves every field empty, as the upload would: scored, not skipped.
    const text = await extractDocument({
      bytes,
      mime: path === "photo" ? "image/png" : "application/pdf",
    }).then(
      (read) => read.text,
      (error: unknown) => {
        say(`${doc.id} ${path}: not read (${error instanceof Error ? error.message : String(error)})`);
        return "";
      },
    );
    const msPerPage = (performance.now() - started) / (path === "photo" ? 1 : pages.get(doc.id)!);
    for (const bucket of [all, mine]) {
      bucket.times.push(msPerPage);
      bucket.docs += 1;
      if (doc.truth.kind === "certificate") scoreCertificate(bucket.tally, doc.truth, text, doc.id);
      else scoreCard(bucket.tally, doc.truth, text, doc.id);
    }
  }
  print(`${path} path, all generators`, all.tally, all.docs, all.times);
  for (const [generator, bucket] of byGenerator)
    print(`${path} path, ${generator}`, bucket.tally, bucket.docs, bucket.times);
}
if (split === "tune" && args.includes("--failures")) say([...new Set(failures)].join("\n"));
