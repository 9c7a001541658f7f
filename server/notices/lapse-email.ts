// One formatter per zone, made once: luxon built a zone-name formatter for every instant (about 170 us per e-mail, the
// largest share of queueing a run's ten thousand notices); formatToParts on a kept formatter gives the same words.
const lapseFormatters = new Map<string, Intl.DateTimeFormat>();

function lapseFormatter(timeZone: string): Intl.DateTimeFormat {
  let formatter = lapseFormatters.get(timeZone);
  if (!formatter) {
    formatter = new Intl.DateTimeFormat("en-US", {
      timeZone,
      weekday: "long",
      month: "long",
      day: "numeric",
      year: "numeric",
      hour: "numeric",
      minute: "2-digit",
      hour12: true,
      timeZoneName: "short",
    });
    lapseFormatters.set(timeZone, formatter);
  }
  return formatter;
}

/** The lapse instant on the recipient company's wall clock, e.g. "Thursday, July 15, 2027 at 1:01 AM CDT". */
export function formatLapseInstant(lapsesAt: Date, timeZone: string): string {
  const part: Partial<Record<Intl.DateTimeFormatPartTypes, string>> = {};
  for (const p of lapseFormatter(timeZone).formatToParts(lapsesAt)) part[p.type] = p.value;
  return `${part.weekday}, ${part.month} ${part.day}, ${part.year} at ${part.hour}:${part.minute} ${part.dayPeriod} ${part.timeZoneName}`;
}

/** The distinct (zone, lapse instant) pairs of one run's notices ($1 the run), each to be put in words once. */
export const LAPSE_INSTANTS_SQL = `SELECT DISTINCT co.time_zone, date_trunc('milliseconds', n.lapses_at) AS lapses_at
   FROM notices n JOIN credentials c ON c.id = n.credential_id JOIN companies co ON co.id = c.company_id
  WHERE n.job_run_id = $1`;

/** The same characters as the client's escapeHtml: &, <, >, " and '. */
const escapeHtml = (sql: string) =>
  `replace(replace(replace(replace(replace(${sql}, '&', '&amp;'), '<', '&lt;'), '>', '&gt;'), '"', '&quot;'), '''', '&#39;')`;

/**
 * A credential type code as encodeURIComponent writes it: the unreserved characters as they are, every other
 * character as its UTF-8 bytes in %XX (codes are letters, digits and underscores, so in practice the code itself).
 */
export const TYPE_CODE_IN_URL_SQL = (code: string) => `(SELECT string_agg(
     CASE WHEN ch ~ '^[A-Za-z0-9_.!~*''()-]$' THEN ch
          ELSE (SELECT string_agg('%' || upper(lpad(to_hex(get_byte(convert_to(ch, 'UTF8'), i)), 2, '0')), '' ORDER BY i)
                  FROM generate_series(0, octet_length(convert_to(ch, 'UTF8')) - 1) AS i) END, '' ORDER BY k)
     FROM regexp_split_to_table(${code}, '') WITH ORDINALITY AS s(ch, k))`;

/**
 * Every recipient of every notice of one run gets an outbox e-mail (plain text and HTML) and an in-app notification,
 * worded here in one statement: $1 the run, $2 as of, $3 the links' base (no trailing slash), $4/$5/$6 the lapse
 * instants in words by zone (formatLapseInstant, which knows the zone abbreviations PostgreSQL does not word alike).
 * Recipients are the company's provider admins and, for a technician's own card, that technician; a notice's days
 * left are whole days of 24 h rounded up, as shared daysUntil counts them. Rows go in (notice, user) order.
 */
export const QUEUE_LAPSE_MESSAGES_SQL = `WITH said AS (
       SELECT * FROM unnest($4::text[], $5::timestamptz[], $6::text[]) AS w(time_zone, lapses_at, words)
     ), types AS MATERIALIZED (
       -- Materialized: worked out once per type, not once per message.
       SELECT code, name, ${TYPE_CODE_IN_URL_SQL("code")} AS code_in_url FROM credential_types
     ), run_notices AS (
       SELECT n.id AS notice_id, n.threshold_days, date_trunc('milliseconds', n.lapses_at) AS lapses_at, c.type_code,
              c.company_id, c.technician_id
         FROM notices n JOIN credentials c ON c.id = n.credential_id
        WHERE n.job_run_id = $1
     ), addressed AS (
       -- Two equi-joins rather than one OR-join, so the planner can hash-join both against users.
       SELECT r.*, u.id AS user_id FROM run_notices r
         JOIN users u ON u.company_id = r.company_id AND u.role = 'provider_admin' AND u.active
       UNION ALL
       SELECT r.*, u.id AS user_id FROM run_notices r
         JOIN users u ON u.technician_id = r.technician_id AND u.role = 'technician' AND u.active
     ), recipients AS (
       SELECT a.notice_id, a.threshold_days = 0 AS lapsed, a.technician_id, u.id AS user_id, u.email,
              u.name AS user_name, u.role, ty.name AS type_name, ty.code_in_url, co.name AS company_name,
              nullif(t.name, '') AS technician_name, s.words AS lapse_words,
              greatest(ceil((extract(epoch FROM a.lapses_at) - extract(epoch FROM $2::timestamptz)) / 86400), 0)::int AS days
         FROM addressed a
         JOIN users u ON u.id = a.user_id
         JOIN types ty ON ty.code = a.type_code
         JOIN companies co ON co.id = a.company_id
         LEFT JOIN technicians t ON t.id = a.technician_id
         LEFT JOIN said s ON s.time_zone = co.time_zone AND s.lapses_at = a.lapses_at
     ), holders AS (
       SELECT r.*,
              CASE WHEN technician_name IS NULL THEN company_name ELSE technician_name || ' (' || company_name || ')' END AS holder,
              CASE WHEN technician_name IS NULL
                   THEN 'every technician of ' || company_name || ' who needs it is hidden from shops in the directory and cannot take new work orders'
                   ELSE technician_name || ' is hidden from shops in the directory and cannot take new work orders' END AS hidden,
              $3::text || CASE WHEN role = 'technician' THEN '/technician/upload-card?type=' || code_in_url
                               WHEN technician_id IS NULL THEN '/provider/documents/new?type=' || code_in_url
                               ELSE '/provider/documents/new?type=' || code_in_url || '&technicianId=' || technician_id END AS link
         FROM recipients r
     ), worded AS (
       SELECT h.notice_id, h.user_id, h.email, h.user_name, h.link,
              CASE WHEN lapsed THEN 'credential_lapsed' ELSE 'credential_lapsing' END AS kind,
              CASE WHEN lapsed THEN 'Lapsed: ' || type_name || ' for ' || holder
                   ELSE type_name || ' for ' || holder || ' lapses in ' || days || ' day' || CASE WHEN days = 1 THEN '' ELSE 's' END END AS title,
              CASE WHEN lapsed
                   THEN type_name || ' held by ' || holder || ' lapsed on ' || lapse_words || '. It no longer counts: ' || hidden
                        || ' until a renewal is uploaded and a Clearbench reviewer verifies it.'
                   ELSE type_name || ' held by ' || holder || ' lapses on ' || lapse_words
                        || '. If no verified renewal is on file by then, ' || hidden || '.' END AS body,
              CASE WHEN lapsed THEN 'Upload the renewal now; once a reviewer verifies it, the standing is restored.'
                   ELSE 'Upload the renewal before then, leaving a reviewer time to verify it.' END AS next
         FROM holders h
     ), mail AS (
       INSERT INTO outbox_messages (to_address, subject, text_body, html_body)
       -- Joined with || (not concat_ws), so a missing part fails the statement instead of leaving a line out.
       SELECT email, title,
              'Hello ' || user_name || ',' || E'\\n\\n' || body || E'\\n\\n' || next || E'\\n\\n'
                || 'Upload the renewal: ' || link || E'\\n\\nClearbench',
              '<p>Hello ' || ${escapeHtml("user_name")} || ',</p>' || E'\\n<p>' || ${escapeHtml("body")} || '</p>'
                || E'\\n<p><strong>' || ${escapeHtml("next")} || '</strong></p>'
                || E'\\n<p><a href="' || ${escapeHtml("link")} || '">Upload the renewal</a></p>' || E'\\n<p>Clearbench</p>'
         FROM worded ORDER BY notice_id, user_id
       RETURNING 1
     ), note AS (
       INSERT INTO notifications (user_id, kind, title, body, link, notice_id)
       SELECT user_id, kind, title, body, link, notice_id FROM worded ORDER BY notice_id, user_id
       RETURNING 1
     )
     SELECT (SELECT count(*) FROM mail)::int AS emails, (SELECT count(*) FROM note)::int AS notifications`;
