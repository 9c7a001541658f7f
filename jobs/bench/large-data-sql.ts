import {
  BUILDERS,
  COMPANY_WORDS,
  FIRST_NAMES,
  INSURERS,
  LAST_NAMES,
  SERVICE_SUFFIXES,
  SHOP_SUFFIXES,
  sqlTextArray,
} from "./large-data-names.ts";
import { benchSettings } from "./bench-settings.ts";

const scaled = (n: number) => Math.max(10, Math.round(n * benchSettings.scale));

/**
 * Sizes of the large data set. `--scale` multiplies the provider side (companies, technicians, credentials, work and
 * reviews); the shops and their sites stay as they are, so each search, route and page asks the same question of more
 * data.
 */
export const LARGE = {
  serviceCompanies: scaled(3_000),
  technicians: scaled(30_000),
  credentials: scaled(300_000),
  shops: 500,
  sites: 1_000,
  workOrders: scaled(60_000),
  reviews: scaled(40_000),
} as const;

// Company-held credentials per service company: current and prior general liability, current and prior workers'
// compensation, auto and umbrella. The rest of the 300,000 are technicians' cards.
const COMPANY_CREDENTIALS_EACH = 6;
export const COMPANY_CREDENTIALS = LARGE.serviceCompanies * COMPANY_CREDENTIALS_EACH;
export const TECHNICIAN_CREDENTIALS = LARGE.credentials - COMPANY_CREDENTIALS;

const S = LARGE.serviceCompanies;
const P = LARGE.shops;
const T = LARGE.technicians;
/** Fixed ids: service companies 1..S, shops S+1..S+P, the platform S+P+1; users 1..S are the offices, S+s the buyers. */
export const IDS = {
  platformCompany: S + P + 1,
  reviewerUser: S + P + 1,
  adminUser: S + P + 2,
  // Above every office, buyer and staff id at any scale (10,001 at scale 1 and below).
  firstTechnicianUser: Math.max(10_001, S + P + 3),
  shopCompany: (ordinal: number) => S + ordinal,
  buyerUser: (ordinal: number) => S + ordinal,
};

const PAIRS = BUILDERS.flatMap((b) => b.controls.map((c) => ({ builder: b.name, control: c })));
const BUILDER_OF_PAIR = sqlTextArray(PAIRS.map((p) => p.builder));
const CONTROL_OF_PAIR = sqlTextArray(PAIRS.map((p) => p.control));
const TECHNOLOGIES = sqlTextArray([
  "mill",
  "lathe",
  "mill_turn",
  "wire_edm",
  "sinker_edm",
  "grinder",
  "laser",
  "waterjet",
  "press_brake",
  "router",
]);
const TECHNICIAN_KINDS = sqlTextArray([
  "osha_10",
  "arc_flash",
  "lockout_tagout",
  "first_aid_cpr",
  "oem_training",
  "powered_truck",
  "oem_training",
  "confined_space",
  "lockout_tagout",
  "arc_flash",
]);

/** pick(array, r): one element for a uniform r in [0, 1). */
const pick = (array: string, r: string) => `(${array})[1 + floor(${r} * array_length(${array}, 1))::int]`;
const rnd = (g: string, salt: number) => `pg_temp.rnd(${g}, ${salt})`;
const zipAt = (r: string) => `(1 + floor(${r} * (SELECT count(*) FROM bench_zips))::int)`;

/**
 * A deterministic uniform number in [0, 1) per (row, salt): a seeded hash rather than random(), so the data set does not
 * depend on the order PostgreSQL happens to produce rows in.
 */
export const SEEDED_RANDOM_SQL = `CREATE FUNCTION pg_temp.rnd(g bigint, salt int) RETURNS float8 LANGUAGE sql IMMUTABLE AS
  $$ SELECT (hashint8extended(g, salt + 20261202) & 2147483647)::float8 / 2147483648 $$`;

export const ZIPS_TABLE_SQL = `CREATE TEMP TABLE bench_zips (i int PRIMARY KEY, zip text UNIQUE, lat float8, lon float8, tz text)`;

export function companiesSql(): string {
  const name = (g: string, suffixes: string) =>
    `${pick(sqlTextArray(COMPANY_WORDS), rnd(g, 1))} || ' ' || ${pick(sqlTextArray(COMPANY_WORDS), rnd(g, 2))} || ' ' || ${pick(suffixes, rnd(g, 3))}`;
  return `
    INSERT INTO companies (id, name, kind, address_line, postal_code, time_zone, latitude, longitude)
    SELECT g, ${name("g", sqlTextArray(SERVICE_SUFFIXES))}, 'service', (100 + g) || ' Service Road', z.zip, z.tz, z.lat, z.lon
      FROM generate_series(1, ${S}) g JOIN bench_zips z ON z.i = ${zipAt(rnd("g", 4))};
    INSERT INTO companies (id, name, kind, address_line, postal_code, time_zone, latitude, longitude)
    SELECT ${S} + g, ${name("g + 100000", sqlTextArray(SHOP_SUFFIXES))}, 'shop', (10 + g) || ' Foundry Lane', z.zip, z.tz, z.lat, z.lon
      FROM generate_series(1, ${P}) g JOIN bench_zips z ON z.i = ${zipAt(rnd("g", 5))};
    INSERT INTO companies (id, name, kind, time_zone) VALUES (${IDS.platformCompany}, 'Clearbench Operations', 'platform', 'America/Chicago');
    SELECT setval('companies_id_seq', (SELECT max(id) FROM companies));`;
}

/** Offices, buyers, one reviewer, one admin; every password the same bcrypt hash ($1). */
export function usersSql(): string {
  return `
    INSERT INTO users (id, company_id, email, name, role, password_hash)
    SELECT g, g, 'office-' || g || '@service.large.test', 'Office ' || g, 'provider_admin', $1 FROM generate_series(1, ${S}) g;
    INSERT INTO users (id, company_id, email, name, role, password_hash)
    SELECT ${S} + g, ${S} + g, 'buyer-' || g || '@shop.large.test', 'Buyer ' || g, 'buyer', $1 FROM generate_series(1, ${P}) g;
    INSERT INTO users (id, company_id, email, name, role, password_hash) VALUES
      (${IDS.reviewerUser}, ${IDS.platformCompany}, 'reviewer@large.test', 'Reviewer', 'reviewer', $1),
      (${IDS.adminUser}, ${IDS.platformCompany}, 'admin@large.test', 'Admin', 'admin', $1);`;
}

export function techniciansSql(): string {
  const tech = (salt: number) => pick(TECHNOLOGIES, rnd("g", salt));
  const pair = (salt: number) => `(1 + floor(${rnd("g", salt)} * ${PAIRS.length})::int)`;
  return `
    INSERT INTO technicians (id, company_id, name, email, technologies, control_families, postal_code, latitude, longitude,
                             service_radius_km, hourly_rate_cents, travel_rate_cents)
    SELECT g, c.id, ${pick(sqlTextArray(FIRST_NAMES), rnd("g", 6))} || ' ' || ${pick(sqlTextArray(LAST_NAMES), rnd("g", 7))},
           'tech-' || g || '@service.large.test',
           ARRAY(SELECT DISTINCT x FROM unnest(ARRAY[${tech(8)}, CASE WHEN ${rnd("g", 9)} < 0.6 THEN ${tech(10)} END,
                 CASE WHEN ${rnd("g", 11)} < 0.25 THEN ${tech(12)} END]) x WHERE x IS NOT NULL)::varchar[],
           ARRAY(SELECT DISTINCT x FROM unnest(ARRAY[(${CONTROL_OF_PAIR})[${pair(13)}],
                 CASE WHEN ${rnd("g", 15)} < 0.5 THEN (${CONTROL_OF_PAIR})[${pair(14)}] END]) x WHERE x IS NOT NULL)::varchar[],
           z.zip, z.lat, z.lon,
           (ARRAY[80, 120, 160, 160, 250, 400])[1 + floor(${rnd("g", 16)} * 6)::int],
           9000 + floor(${rnd("g", 17)} * 120)::int * 100, 6000 + floor(${rnd("g", 18)} * 60)::int * 100
      FROM generate_series(1, ${T}) g
      JOIN companies c ON c.id = 1 + (g - 1) % ${S}
      JOIN bench_zips home ON home.zip = c.postal_code
      -- Six in ten work from their company's own postal code, the rest from anywhere.
      JOIN bench_zips z ON z.i = CASE WHEN ${rnd("g", 19)} < 0.6 THEN home.i ELSE ${zipAt(rnd("g", 20))} END;
    SELECT setval('technicians_id_seq', (SELECT max(id) FROM technicians));
    INSERT INTO users (id, company_id, email, name, role, password_hash, technician_id)
    SELECT ${IDS.firstTechnicianUser} + t.id, t.company_id, t.email, t.name, 'technician', $1, t.id FROM technicians t WHERE t.id % 10 = 0;
    SELECT setval('users_id_seq', (SELECT max(id) FROM users));
    INSERT INTO documents (id, company_id, uploaded_by, sha256, size_bytes, mime, original_name, extraction_method)
    SELECT g, g, g, encode(sha256(('large-' || g)::bytea), 'hex'), 48000, 'application/pdf', 'certificate-' || g || '.pdf', 'text'
      FROM generate_series(1, ${S}) g;
    SELECT setval('documents_id_seq', (SELECT max(id) FROM documents));`;
}

/** Insurance held by each company: a current and a prior policy for GL and WC, a current auto and umbrella. $1 = anchor. */
export function companyCredentialsSql(): string {
  const family = `CASE k WHEN 0 THEN 0 WHEN 1 THEN 0 WHEN 2 THEN 1 WHEN 3 THEN 1 WHEN 4 THEN 2 ELSE 3 END`;
  return `
    WITH gen AS (
      SELECT c, k, ${family} AS f,
             -- Current policies expire from 18 days ago to a year ahead (about 5 % already lapsed); prior ones a year earlier.
             ($1::date + (floor(pg_temp.rnd(c, 30 + ${family}) * 365)::int - 18) - CASE WHEN k IN (1, 3) THEN 365 ELSE 0 END) AS expires
        FROM generate_series(1, ${S}) c CROSS JOIN generate_series(0, ${COMPANY_CREDENTIALS_EACH - 1}) k
    ), shaped AS (
      SELECT gen.*, (expires::timestamp + interval '6 hours 1 minute') AT TIME ZONE 'UTC' AS lapses_at,
             (ARRAY['general_liability','general_liability','workers_comp','workers_comp','auto_liability','umbrella_liability'])[k + 1] AS type_code,
             CASE WHEN k IN (1, 3) THEN 'superseded' WHEN pg_temp.rnd(c * 10 + k, 31) < 0.02 THEN 'submitted' END AS fixed_state
        FROM gen
    )
    INSERT INTO credentials (type_code, company_id, technician_id, document_id, state, fields, submitted_by, submitted_at, decided_by, decided_at, lapses_at)
    SELECT type_code, c, NULL, c,
           coalesce(fixed_state, CASE WHEN lapses_at > $1::timestamptz THEN 'verified' ELSE 'lapsed' END),
           jsonb_build_object(
             'insurerName', ${pick(sqlTextArray(INSURERS), "pg_temp.rnd(c, 32 + f)")},
             -- Demo NAIC codes: "000" and two digits, a shape no insurer should hold (server/db/demo-scenario/demo-naic.ts).
             'naic', '000' || lpad(floor(pg_temp.rnd(c, 33 + f) * 100)::int::text, 2, '0'),
             'policyNumber', upper(left(type_code, 2)) || '-' || c || '-' || k,
             'effectiveDate', to_char(expires - 365, 'YYYY-MM-DD'),
             'expirationDate', to_char(expires, 'YYYY-MM-DD'),
             'limits', CASE f
               WHEN 0 THEN jsonb_build_object('eachOccurrence', e.occ, 'generalAggregate', e.occ * 2, 'medicalExpense', 5000)
               WHEN 1 THEN jsonb_build_object('employersLiabilityEachAccident', 1000000, 'employersLiabilityDiseaseEachEmployee', 1000000, 'employersLiabilityDiseasePolicyLimit', 1000000)
               WHEN 2 THEN jsonb_build_object('combinedSingleLimit', (ARRAY[500000, 1000000, 1000000])[1 + floor(pg_temp.rnd(c, 35) * 3)::int])
               ELSE jsonb_build_object('umbrellaEachOccurrence', e.occ * 2, 'umbrellaAggregate', e.occ * 2) END,
             'additionalInsured', pg_temp.rnd(c, 36) < 0.7,
             'waiverOfSubrogation', pg_temp.rnd(c, 37) < 0.5,
             'statutory', f = 1),
           c, (expires - 365 - 10)::timestamptz, CASE WHEN fixed_state = 'submitted' THEN NULL ELSE ${IDS.reviewerUser} END,
           CASE WHEN fixed_state = 'submitted' THEN NULL ELSE (expires - 365 - 8)::timestamptz END, lapses_at
      FROM shaped
      CROSS JOIN LATERAL (SELECT (ARRAY[500000, 1000000, 1000000, 2000000])[1 + floor(pg_temp.rnd(c, 34) * 4)::int] AS occ) e
     ORDER BY c, k`;
}

/**
 * Technicians' cards: each technician gets an OSHA 10, two or three refresher cards, two machine-builder trainings, a
 * confined-space card, and older superseded copies. Lapse dates run from six months ago to eighteen months ahead, so
 * the spread covers two years; 5 % wait for review and 3 % were returned. $1 = anchor.
 */
export function technicianCredentialsSql(): string {
  return `
    WITH gen AS (
      SELECT g, 1 + (g - 1) % ${T} AS t, (g - 1) / ${T} AS k FROM generate_series(1, ${TECHNICIAN_CREDENTIALS}) g
    ), typed AS (
      SELECT gen.*, (${TECHNICIAN_KINDS})[k + 1] AS type_code, pg_temp.rnd(g, 40) AS r,
             CASE WHEN (${TECHNICIAN_KINDS})[k + 1] IN ('osha_10', 'confined_space') THEN NULL
                  WHEN k >= 8 THEN $1::date - 400 + floor(pg_temp.rnd(g, 41) * 200)::int
                  ELSE $1::date - 180 + floor(pg_temp.rnd(g, 41) * 730)::int END AS expires
        FROM gen
    ), shaped AS (
      SELECT typed.*, (expires::timestamp + interval '1 day 6 hours') AT TIME ZONE 'UTC' AS lapses_at,
             CASE WHEN k >= 8 THEN 'superseded' WHEN r < 0.05 THEN 'submitted' WHEN r < 0.08 THEN 'returned' END AS fixed_state,
             coalesce(expires - 365, $1::date - floor(pg_temp.rnd(g, 42) * 1500)::int) AS issued,
             1 + floor(pg_temp.rnd(t, CASE WHEN k = 4 THEN 13 ELSE 14 END) * ${PAIRS.length})::int AS pair
        FROM typed
    )
    INSERT INTO credentials (type_code, company_id, technician_id, document_id, state, fields, return_reason, submitted_by,
                             submitted_at, decided_by, decided_at, lapses_at)
    SELECT s.type_code, te.company_id, s.t, te.company_id,
           coalesce(s.fixed_state, CASE WHEN s.lapses_at IS NULL OR s.lapses_at > $1::timestamptz THEN 'verified' ELSE 'lapsed' END),
           jsonb_strip_nulls(jsonb_build_object(
             'holderName', te.name, 'course', replace(s.type_code, '_', ' '), 'issueDate', to_char(s.issued, 'YYYY-MM-DD'),
             'expiryDate', to_char(s.expires, 'YYYY-MM-DD'), 'cardNumber', 'C-' || s.g, 'trainer', 'Harrowgate Safety Institute'))
           || CASE WHEN s.type_code = 'oem_training' THEN jsonb_build_object(
                'builder', (${BUILDER_OF_PAIR})[s.pair], 'controlFamily', (${CONTROL_OF_PAIR})[s.pair],
                'level', 1 + floor(pg_temp.rnd(s.g, 43) * 3)::int) ELSE '{}'::jsonb END,
           CASE WHEN s.fixed_state = 'returned' THEN 'The card is unreadable; upload a clearer scan' END,
           te.company_id,
           CASE WHEN s.fixed_state = 'submitted' THEN $1::timestamptz - pg_temp.rnd(s.g, 44) * interval '14 days' ELSE s.issued + 3 END,
           CASE WHEN s.fixed_state = 'submitted' THEN NULL ELSE ${IDS.reviewerUser} END,
           CASE WHEN s.fixed_state = 'submitted' THEN NULL ELSE s.issued + 4 END,
           s.lapses_at
      FROM shaped s JOIN technicians te ON te.id = s.t
     ORDER BY s.g`;
}

/** Two sites per shop, two machines per site. */
export function sitesSql(): string {
  return `
    INSERT INTO sites (id, company_id, name, address_line, postal_code, time_zone, latitude, longitude)
    SELECT g, ${S} + 1 + (g - 1) % ${P}, CASE WHEN g <= ${P} THEN 'Main plant' ELSE 'North plant' END,
           (200 + g) || ' Works Avenue', z.zip, z.tz, z.lat, z.lon
      FROM generate_series(1, ${LARGE.sites}) g JOIN bench_zips z ON z.i = ${zipAt(rnd("g + 500000", 50))};
    SELECT setval('sites_id_seq', (SELECT max(id) FROM sites));
    INSERT INTO equipment (site_id, builder, control_family, technology, model, serial_number)
    SELECT 1 + (g - 1) % ${LARGE.sites}, (${BUILDER_OF_PAIR})[p], (${CONTROL_OF_PAIR})[p], ${pick(TECHNOLOGIES, rnd("g", 52))},
           'Model ' || (100 + g % 900), 'SN-' || g
      FROM generate_series(1, ${LARGE.sites * 2}) g CROSS JOIN LATERAL (SELECT 1 + floor(${rnd("g", 51)} * ${PAIRS.length})::int AS p) x;`;
}

/** Work orders from the shops' sites; the first 40,000 are confirmed and carry the reviews. $1 = anchor. */
export function workOrdersSql(): string {
  return `
    WITH gen AS (
      SELECT g, 1 + floor(pg_temp.rnd(g, 60) * ${LARGE.sites})::int AS site_id, 1 + floor(pg_temp.rnd(g, 61) * ${T})::int AS tech,
             $1::timestamptz - pg_temp.rnd(g, 62) * interval '700 days' AS created,
             CASE WHEN g <= ${LARGE.reviews} THEN 'confirmed'
                  ELSE (ARRAY['requested','accepted','declined','completed','confirmed'])[1 + floor(pg_temp.rnd(g, 63) * 5)::int] END AS status
        FROM generate_series(1, ${LARGE.workOrders}) g
    )
    INSERT INTO work_orders (id, shop_company_id, site_id, technician_id, service_company_id, technology, problem, urgency, status,
                             decline_reason, hours_worked, travel_hours, completion_note, created_by, accepted_at, declined_at,
                             completed_at, confirmed_at, created_at, updated_at)
    SELECT g, si.company_id, si.id, te.id, te.company_id, te.technologies[1], 'Spindle alarm on start-up, order ' || g,
           (ARRAY['low','normal','normal','high','down'])[1 + floor(pg_temp.rnd(g, 64) * 5)::int], status,
           CASE WHEN status = 'declined' THEN 'Booked that week' END,
           CASE WHEN status IN ('completed','confirmed') THEN 2 + floor(pg_temp.rnd(g, 65) * 12) / 2 END,
           CASE WHEN status IN ('completed','confirmed') THEN 1 + floor(pg_temp.rnd(g, 66) * 6) / 2 END,
           CASE WHEN status IN ('completed','confirmed') THEN 'Replaced the encoder cable and recalibrated' END,
           si.company_id, CASE WHEN status IN ('accepted','completed','confirmed') THEN created + interval '4 hours' END,
           CASE WHEN status = 'declined' THEN created + interval '2 hours' END,
           CASE WHEN status IN ('completed','confirmed') THEN created + interval '3 days' END,
           CASE WHEN status = 'confirmed' THEN created + interval '4 days' END, created, created
      FROM gen JOIN sites si ON si.id = gen.site_id JOIN technicians te ON te.id = gen.tech;
    SELECT setval('work_orders_id_seq', (SELECT max(id) FROM work_orders));
    -- Each order is for one of its site's two machines, so a machine's history page has its confirmed orders to show.
    UPDATE work_orders w SET equipment_id = e.id
      FROM (SELECT id, site_id, row_number() OVER (PARTITION BY site_id ORDER BY id) - 1 AS k FROM equipment) e
     WHERE e.site_id = w.site_id AND e.k = w.id % 2;
    INSERT INTO job_reviews (work_order_id, technician_id, shop_company_id, author_user_id, stars, body, created_at)
    SELECT w.id, w.technician_id, w.shop_company_id, w.created_by,
           CASE WHEN r < 0.55 THEN 5 WHEN r < 0.83 THEN 4 WHEN r < 0.93 THEN 3 WHEN r < 0.97 THEN 2 ELSE 1 END,
           'Arrived on time and left the machine running.', w.confirmed_at + interval '1 day'
      FROM work_orders w CROSS JOIN LATERAL (SELECT pg_temp.rnd(w.id, 67) AS r) x
     WHERE w.id <= ${LARGE.reviews} ORDER BY w.id;
    INSERT INTO technician_ratings (technician_id, review_count, star_sum)
    SELECT technician_id, count(*), sum(stars) FROM job_reviews GROUP BY technician_id;`;
}

/**
 * The notices a daily job would already have written by the anchor (one per credential, the smallest window it is in),
 * so the bench's job run sees a steady state rather than a first run over an imported registry. $1 = anchor.
 */
export function steadyStateNoticesSql(warningDays: readonly number[]): string {
  return `
    INSERT INTO notices (credential_id, threshold_days, lapses_at)
    SELECT c.id, (SELECT min(d) FROM unnest($2::int[]) d WHERE c.lapses_at <= $1::timestamptz + d * interval '24 hours'), c.lapses_at
      FROM credentials c
     WHERE c.state = 'verified' AND c.lapses_at > $1::timestamptz
       AND c.lapses_at <= $1::timestamptz + ${Math.max(...warningDays)} * interval '24 hours'`;
}
