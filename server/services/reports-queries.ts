/**
 * The reports' SQL. Every statement takes the same parameters: $1 organization, $2 first
 * day, $3 last day (dates, inclusive), $4 the IANA zone those days are in, $5 one property
 * or null. All aggregation happens in PostgreSQL; the service only renames columns.
 */
import { APPLIANCE_STYLES } from '../../shared/domain';
import { expectedLifeYears } from '../../shared/api/fleet-constants';

/** The range as instants: from the first day's midnight to the midnight after the last day. */
const BOUNDS = `bounds AS (
  SELECT ($2::date)::timestamp AT TIME ZONE $4 AS starts_at, ($3::date + 1)::timestamp AT TIME ZONE $4 AS ends_at
)`;

const PROPERTY_FILTER = (column: string) => `($5::uuid IS NULL OR ${column} = $5::uuid)`;

/**
 * Incidents that count as the appliance's own trouble: appliance incidents on the repair
 * lane, not those a property's power loss explains (the building's trouble) nor sensor
 * faults (the sensor's).
 */
const APPLIANCE_TROUBLE = `i.lane = 'repair' AND i.property_incident_id IS NULL`;

/**
 * Per month: incidents opened on the appliances in scope, and the appliances in service
 * that month as the denominator. An appliance is in service on a month when it was in
 * service on at least one day of it (within the range): from the later of its install
 * date and the day it joined the inventory (before that nothing watched it, so it could
 * not have had an incident here), until it was archived.
 */
export const INCIDENT_RATE_SQL = `
WITH ${BOUNDS},
months AS MATERIALIZED (
  SELECT to_char(m, 'YYYY-MM') AS month,
         greatest(m AT TIME ZONE $4, b.starts_at) AS starts_at,
         least((m + interval '1 month') AT TIME ZONE $4, b.ends_at) AS ends_at
  FROM bounds b, generate_series(date_trunc('month', $2::date::timestamp), date_trunc('month', $3::date::timestamp), interval '1 month') AS m
),
fleet AS MATERIALIZED (
  SELECT a.id, greatest(a.installed_on::timestamp AT TIME ZONE $4, a.created_at) AS in_service_from, a.archived_at
  FROM appliance a JOIN unit u ON u.id = a.unit_id JOIN property p ON p.id = u.property_id
  WHERE p.organization_id = $1 AND ${PROPERTY_FILTER('p.id')}
),
in_service AS (
  SELECT m.month, count(f.id) AS appliances
  FROM months m LEFT JOIN fleet f ON f.in_service_from < m.ends_at AND (f.archived_at IS NULL OR f.archived_at > m.starts_at)
  GROUP BY m.month
),
opened AS (
  SELECT to_char(i.opened_at AT TIME ZONE $4, 'YYYY-MM') AS month, count(*) AS incidents
  FROM incident i JOIN fleet f ON f.id = i.appliance_id CROSS JOIN bounds b
  WHERE i.organization_id = $1 AND ${APPLIANCE_TROUBLE} AND i.opened_at >= b.starts_at AND i.opened_at < b.ends_at
  GROUP BY 1
)
SELECT m.month, coalesce(s.appliances, 0)::int AS appliances_in_service, coalesce(o.incidents, 0)::int AS incidents
FROM months m LEFT JOIN in_service s ON s.month = m.month LEFT JOIN opened o ON o.month = m.month
ORDER BY m.month`;

/**
 * The requests opened in the range (merged ones count in the request they joined). A
 * request opens when its incident opened, or when it was raised (a tenant's or a
 * manager's request), whichever came first.
 */
const REQUESTS_IN_RANGE = `
requests AS (
  SELECT sr.id, sr.property_id, sr.appliance_id, i.top_cause, least(sr.opened_at, i.opened_at) AS started_at
  FROM service_request sr LEFT JOIN incident i ON i.id = sr.incident_id
  WHERE sr.organization_id = $1 AND sr.status <> 'merged' AND ${PROPERTY_FILTER('sr.property_id')}
    -- started_at is never after opened_at, so this bound loses nothing and lets the
    -- (organization_id, opened_at) index skip the requests of earlier years.
    AND sr.opened_at >= (SELECT starts_at FROM bounds)
),
in_range AS (
  SELECT r.* FROM requests r, bounds b WHERE r.started_at >= b.starts_at AND r.started_at < b.ends_at
)`;

const MEAN_MINUTES = (column: string) => `round(avg(extract(epoch FROM ${column} - started_at)) / 60)::float8`;

/**
 * Opened → first work order dispatched, → first completion, → first verification, over the
 * requests opened in the range. completed_at holds a work order's latest completion (a
 * reopened job is completed again), so "repair" is the completion that was then judged.
 * First-visit fix: of the work orders of those requests whose repair was judged (verified,
 * or reopened by a failed verification), the share verified without a reopen.
 */
export const RESPONSE_TIMES_SQL = `
WITH ${BOUNDS}, ${REQUESTS_IN_RANGE},
steps AS (
  SELECT r.id, r.started_at, min(wo.dispatched_at) AS dispatched_at, min(wo.completed_at) AS completed_at, min(wo.verified_at) AS verified_at
  FROM in_range r LEFT JOIN work_order wo ON wo.service_request_id = r.id
  GROUP BY r.id, r.started_at
),
judged AS (
  SELECT wo.state, wo.reopened_count FROM in_range r JOIN work_order wo ON wo.service_request_id = r.id
  WHERE wo.state = 'verified' OR wo.reopened_count > 0
)
SELECT
  (SELECT count(*) FROM steps)::int AS requests,
  (SELECT count(dispatched_at) FROM steps)::int AS dispatched,
  (SELECT ${MEAN_MINUTES('dispatched_at')} FROM steps) AS dispatch_minutes,
  (SELECT count(completed_at) FROM steps)::int AS completed,
  (SELECT ${MEAN_MINUTES('completed_at')} FROM steps) AS repair_minutes,
  (SELECT count(verified_at) FROM steps)::int AS verified,
  (SELECT ${MEAN_MINUTES('verified_at')} FROM steps) AS verified_minutes,
  (SELECT count(*) FROM judged WHERE state = 'verified' AND reopened_count = 0)::int AS fixed_first_visit,
  (SELECT count(*) FROM judged)::int AS judged`;

/** Every cost line of a work order in integer cents; labour rounded per line, as the work order view does. */
const COST_LINES = `
  SELECT part.work_order_id, part.currency, 'parts' AS kind, part.quantity::bigint * part.unit_cost_cents AS cents, part.created_at FROM work_order_part part
  UNION ALL
  SELECT labour.work_order_id, labour.currency, 'labour' AS kind, round(labour.minutes::numeric * labour.hourly_rate_cents / 60)::bigint AS cents, labour.created_at FROM work_order_labour labour`;

/** Spend is counted when it was recorded: each part or labour line in the range. */
const SPEND_LINES = `
WITH ${BOUNDS},
lines AS (
  SELECT line.*, wo.cost_status, sr.property_id, sr.appliance_id
  FROM (${COST_LINES}) line
  JOIN work_order wo ON wo.id = line.work_order_id
  JOIN service_request sr ON sr.id = wo.service_request_id
  CROSS JOIN bounds b
  WHERE wo.organization_id = $1 AND ${PROPERTY_FILTER('sr.property_id')} AND line.created_at >= b.starts_at AND line.created_at < b.ends_at
)`;

const cents = (condition: string) => `coalesce(sum(l.cents) FILTER (WHERE ${condition}), 0)::float8`;

const SPEND_FIGURES = `l.currency,
  ${cents(`l.kind = 'parts'`)} AS parts_cents,
  ${cents(`l.kind = 'labour'`)} AS labour_cents,
  ${cents(`l.cost_status = 'approved'`)} AS approved_cents,
  ${cents(`l.cost_status = 'pending'`)} AS pending_cents,
  ${cents(`l.cost_status NOT IN ('approved', 'pending')`)} AS other_cents,
  coalesce(sum(l.cents), 0)::float8 AS total_cents,
  count(DISTINCT l.work_order_id)::int AS work_orders`;

export const SPEND_BY_PROPERTY_SQL = `${SPEND_LINES}
SELECT p.id AS property_id, p.name AS property_name, ${SPEND_FIGURES}
FROM lines l JOIN property p ON p.id = l.property_id
GROUP BY p.id, p.name, l.currency
ORDER BY total_cents DESC, p.name, l.currency`;

export const SPEND_BY_APPLIANCE_SQL = `${SPEND_LINES}
SELECT a.id AS appliance_id, a.style, a.model, u.label AS unit_label, p.id AS property_id, p.name AS property_name, ${SPEND_FIGURES}
FROM lines l JOIN appliance a ON a.id = l.appliance_id JOIN unit u ON u.id = a.unit_id JOIN property p ON p.id = u.property_id
GROUP BY a.id, a.style, a.model, u.label, p.id, p.name, l.currency
ORDER BY total_cents DESC, p.name, u.label, l.currency`;

/**
 * The expected life of `a.style` in years, from the table the appliance page and the fleet
 * use (shared/api/fleet-constants.ts): refrigerator about 13 years, freezer about 11
 * (NAHB / Bank of America Home Equity, "Study of Life Expectancy of Home Components", 2007).
 */
const LIFE_YEARS = `(CASE a.style ${APPLIANCE_STYLES.map((style) => `WHEN '${style}' THEN ${expectedLifeYears(style)}`).join(' ')} END)`;
const YEAR_DAYS = 365.2425;

/**
 * Appliances in service at the end of the range that are older than their expected life
 * then. The service keeps the ones whose age, rounded as the appliance page rounds it, is
 * past the expected life, so both pages agree at the boundary.
 */
export const PAST_LIFE_SQL = `
WITH ${BOUNDS}
SELECT a.id AS appliance_id, a.style, a.model, a.installed_on::text AS installed_on, u.label AS unit_label, p.id AS property_id, p.name AS property_name,
  (SELECT count(*) FROM incident i WHERE i.appliance_id = a.id AND ${APPLIANCE_TROUBLE} AND i.opened_at >= b.starts_at AND i.opened_at < b.ends_at)::int AS incidents
FROM appliance a JOIN unit u ON u.id = a.unit_id JOIN property p ON p.id = u.property_id CROSS JOIN bounds b
WHERE p.organization_id = $1 AND ${PROPERTY_FILTER('p.id')}
  AND a.installed_on IS NOT NULL AND a.created_at < b.ends_at AND (a.archived_at IS NULL OR a.archived_at >= b.ends_at)
  AND ($3::date - a.installed_on) / ${YEAR_DAYS} > ${LIFE_YEARS}
ORDER BY a.installed_on, p.name, u.label, a.id`;

/**
 * The cause of each request opened in the range: what the technician recorded on its
 * latest completed work order, else the diagnosis' top cause, else unknown. Its spend is
 * every cost line of its work orders, whenever recorded.
 */
export const TOP_CAUSES_SQL = `
WITH ${BOUNDS}, ${REQUESTS_IN_RANGE},
orders AS MATERIALIZED (
  SELECT wo.id, wo.service_request_id, wo.completed_at, wo.cause_found FROM work_order wo JOIN in_range r ON r.id = wo.service_request_id
),
found AS (
  SELECT DISTINCT ON (o.service_request_id) o.service_request_id AS id, o.cause_found
  FROM orders o WHERE o.completed_at IS NOT NULL AND o.cause_found IS NOT NULL
  ORDER BY o.service_request_id, o.completed_at DESC
),
causes AS MATERIALIZED (
  SELECT r.id, coalesce(f.cause_found, r.top_cause, 'unknown') AS cause, f.cause_found IS NOT NULL AS found_on_site
  FROM in_range r LEFT JOIN found f ON f.id = r.id
),
cause_spend AS (
  SELECT c.cause, line.currency, sum(line.cents)::float8 AS cents
  FROM causes c JOIN orders o ON o.service_request_id = c.id JOIN (${COST_LINES}) line ON line.work_order_id = o.id
  GROUP BY c.cause, line.currency
),
cause_counts AS (
  SELECT cause, count(*)::int AS requests, (count(*) FILTER (WHERE found_on_site))::int AS found_on_site FROM causes GROUP BY cause
)
SELECT cc.cause, cc.requests, cc.found_on_site,
  coalesce(json_agg(json_build_object('currency', cs.currency, 'cents', cs.cents) ORDER BY cs.currency) FILTER (WHERE cs.currency IS NOT NULL), '[]'::json) AS spend
FROM cause_counts cc LEFT JOIN cause_spend cs ON cs.cause = cc.cause
GROUP BY cc.cause, cc.requests, cc.found_on_site
ORDER BY cc.requests DESC, cc.cause`;
