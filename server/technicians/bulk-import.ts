import { Op, fn, col, where as sqlWhere } from "sequelize";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { lookupPostalCode } from "../geo/index.ts";
import { issueToken } from "../accounts/tokens.ts";
import { inviteMail } from "../accounts/emails.ts";
import { enqueueMail } from "../mail/outbox.ts";
import { readImportTable } from "../imports/import-table.ts";
import { Technician } from "./model.ts";
import { DEFAULT_MILEAGE_RATE_CENTS } from "./service.ts";
import {
  checkRow,
  columnMappingSchema,
  guessMapping,
  importFields,
  type CheckedRow,
  type ColumnMapping,
  type TechnicianImportPreview,
  type TechnicianImportReport,
} from "../../shared/technicians/bulk-import.ts";
import { Company, User } from "../db/models.ts";

export const MAX_IMPORT_ROWS = 5_000;

interface UploadedFile {
  path: string;
  originalname: string;
  mimetype: string;
}

async function checkFile(companyId: number, file: UploadedFile | undefined, mappingRaw: string | undefined) {
  const { headers, records, mapping } = await readImportTable(file, mappingRaw, {
    maxRows: MAX_IMPORT_ROWS,
    fields: importFields,
    mappingSchema: columnMappingSchema,
    guess: guessMapping,
  });
  const rows = records.map((record, i) =>
    checkRow(i + 2, record, mapping, (zip) => lookupPostalCode(zip) !== undefined),
  );

  // Duplicates: an e-mail twice in the file, an e-mail already signed in anywhere on the platform or on this
  // company's technicians, and (for rows without e-mail) the same name at the same ZIP already on the roster.
  const emails = rows.flatMap((r) => (r.input?.email ? [r.input.email] : []));
  const [users, technicians] = await Promise.all([
    emails.length
      ? User.findAll({
          where: sqlWhere(fn("lower", col("email")), { [Op.in]: emails }),
          attributes: ["email"],
        })
      : [],
    Technician.findAll({ where: { companyId }, attributes: ["name", "email", "postalCode"] }),
  ]);
  const taken = new Set([
    ...users.map((u) => u.email.toLowerCase()),
    ...technicians.flatMap((t) => (t.email ? [t.email.toLowerCase()] : [])),
  ]);
  const onRoster = new Set(technicians.map((t) => `${t.name.trim().toLowerCase()}|${t.postalCode}`));
  const firstLine = new Map<string, number>();
  for (const row of rows) {
    if (!row.input) continue;
    const { email, name, postalCode } = row.input;
    if (email) {
      const earlier = firstLine.get(email);
      if (earlier !== undefined)
        row.problems.push(`E-mail: ${email} is also on line ${earlier} of this file`);
      else firstLine.set(email, row.line);
      if (taken.has(email)) row.problems.push(`E-mail: ${email} is already on the platform`);
    } else if (onRoster.has(`${name.toLowerCase()}|${postalCode}`)) {
      row.problems.push(`Name: ${name} at ZIP ${postalCode} is already on your roster`);
    }
    if (row.problems.length > 0) row.input = null;
  }
  return { headers, mapping, rows };
}

function summarize(headers: string[], mapping: ColumnMapping, rows: CheckedRow[]): TechnicianImportPreview {
  const shown = rows.map((r) => ({
    line: r.line,
    name: r.input?.name ?? "",
    email: r.input?.email ?? null,
    problems: r.problems,
  }));
  const goodCount = rows.filter((r) => r.input).length;
  return { headers, mapping, rows: shown, goodCount, badCount: rows.length - goodCount };
}

export async function previewImport(actor: Express.User, file: UploadedFile | undefined, mapping?: string) {
  const { headers, mapping: used, rows } = await checkFile(actor.companyId, file, mapping);
  return summarize(headers, used, rows);
}

/** Imports every good row and invites those with e-mail, all in one transaction: all of them or none. */
export async function runImport(
  actor: Express.User,
  file: UploadedFile | undefined,
  mapping: string | undefined,
  linkBase: string,
): Promise<TechnicianImportReport> {
  const { rows } = await checkFile(actor.companyId, file, mapping);
  const good = rows.flatMap((r) => (r.input ? [r.input] : []));
  const company = await Company.findByPk(actor.companyId);
  if (!company) throw new AppError("not_found", "That company was not found");
  let invited = 0;
  await db().transaction(async (transaction) => {
    // One import at a time per company, so two uploads of the same file cannot both pass the duplicate check.
    await db().query("SELECT pg_advisory_xact_lock(hashtext('technician-import'), :companyId)", {
      replacements: { companyId: actor.companyId },
      transaction,
    });
    const created = await Technician.bulkCreate(
      good.map((g) => {
        const place = lookupPostalCode(g.postalCode)!;
        return {
          companyId: actor.companyId,
          name: g.name,
          email: g.email,
          phone: g.phone,
          technologies: g.technologies,
          controlFamilies: [],
          postalCode: g.postalCode,
          latitude: place.latitude,
          longitude: place.longitude,
          serviceRadiusKm: g.serviceRadiusKm,
          hourlyRateCents: g.hourlyRateCents,
          travelRateCents: g.travelRateCents,
          mileageRateCents: DEFAULT_MILEAGE_RATE_CENTS,
        };
      }),
      { transaction, returning: true },
    );
    for (const t of created) {
      if (!t.email) continue;
      const user = await User.create(
        {
          companyId: company.id,
          email: t.email,
          name: t.name,
          role: "technician",
          passwordHash: null,
          technicianId: t.id,
        },
        { transaction },
      );
      const token = await issueToken(user.id, "invite", transaction);
      await enqueueMail(
        inviteMail(user.email, user.name, company.name, `${linkBase}/set-password?token=${token}`, user.role),
        transaction,
      );
      invited += 1;
    }
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "technician.imported",
        subjectType: "company",
        subjectId: company.id,
        after: { imported: created.length, invited, technicianIds: created.map((t) => t.id) },
      },
      transaction,
    );
  });
  return {
    imported: good.length,
    invited,
    skipped: rows.filter((r) => !r.input).map((r) => ({ line: r.line, problems: r.problems })),
  };
}
