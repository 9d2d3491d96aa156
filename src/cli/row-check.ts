/**
 * The value checks `merge` makes on every row of a part before it joins the map: a number
 * column holds a finite decimal number or nothing (a failed point leaves its state empty),
 * the grid position and the axis values are always there, a list column holds
 * space-separated numbers; NaN, Infinity and text where a number belongs are refused, as is
 * a row with the wrong number of fields (cut short). Returns the problem in words, or null.
 */

/** A decimal number as String(x) writes it (no NaN, no Infinity, no hex). */
const NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i;

/** Columns of the map table that hold text. */
const TEXT_COLUMNS = new Set(['phase', 'fraction', 'atSearchLimit', 'lockedFilling', 'error']);
/** Columns that hold space-separated numbers. */
const LIST_COLUMNS = new Set(['cell', 'sublatticeDensities', 'sublatticeCoherences']);
/** Number fields of a JSON point (beside ix, iy and the axes) when present. */
const JSON_NUMBERS = ['cellSize', 'alpha', 'photonDensity', 'emitterDensity', 'excitationDensity', 'grandPotential', 'mu', 'delta', 'T'];
const JSON_LISTS = ['sublatticeDensities', 'sublatticeCoherences'];

function isNumber(s: string): boolean {
  return NUMBER.test(s) && Number.isFinite(Number(s));
}

function shown(s: string): string {
  return `'${s.length > 40 ? s.slice(0, 40) + '...' : s}'`;
}

/** The problem of one CSV row (its fields, null when a quote does not close) under these columns, or null. */
export function csvRowProblem(columns: readonly string[], fields: readonly string[] | null): string | null {
  if (!fields) return 'a quoted field does not close (the row is cut short)';
  if (fields.length !== columns.length) return `${fields.length} fields, the header has ${columns.length} (the row is cut short or damaged)`;
  const required = columns.indexOf('phase');
  for (let c = 0; c < columns.length; c++) {
    const name = columns[c], v = fields[c];
    if (TEXT_COLUMNS.has(name)) continue;
    if (v === '') {
      if (c < required) return `${name} is empty`;
      continue;
    }
    if (LIST_COLUMNS.has(name)) {
      const bad = v.split(' ').find((x) => !isNumber(x));
      if (bad !== undefined) return `${name} holds ${shown(bad)}, not a number`;
    } else if (!isNumber(v)) {
      return `${name} is ${shown(v)}, not a number`;
    }
  }
  return null;
}

/** The problem of one JSON point with these axis names, or null. */
export function jsonRowProblem(o: unknown, axes: readonly string[]): string | null {
  if (o === null || typeof o !== 'object' || Array.isArray(o)) return 'not a point object';
  const p = o as Record<string, unknown>;
  const num = (k: string) => typeof p[k] === 'number' && Number.isFinite(p[k]);
  for (const k of ['ix', 'iy', ...axes]) if (!num(k)) return `${k} is ${JSON.stringify(p[k]) ?? 'missing'}, not a number`;
  for (const k of JSON_NUMBERS) if (k in p && p[k] !== null && !num(k)) return `${k} is ${JSON.stringify(p[k])}, not a number`;
  for (const k of JSON_LISTS) {
    if (!(k in p)) continue;
    const v = p[k];
    if (!Array.isArray(v) || v.some((x) => typeof x !== 'number' || !Number.isFinite(x))) return `${k} is not a list of numbers`;
  }
  if (p.error === undefined && !num('grandPotential')) return 'a solved point without grandPotential';
  return null;
}
