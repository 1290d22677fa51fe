// Over 300 lines: pure form model of the search-effort screen: parsing, units and resolvers, tested together.
import type { Resolver } from 'react-hook-form';
import {
  SweepWidthRequestSchema,
  SweepWidthTableInputSchema,
  type SweepWidthTableInput,
  type SweepModel,
  type SweepWidthRequest,
  type SweepWidthTable,
} from '@/shared/schemas/sweep-width';
import { convertLength, type LengthUnit } from '@/shared/units/length';
import { restateLengths, retypeLength, typedToMetres } from '@/shared/units/typed-lengths';
import { LENGTH_UNIT_WORDS, UNIT_SYSTEMS, type UnitSystem } from '@/shared/units/unit-systems';
import { distanceIn, lengthIn } from '@/components/check/format';

/** Where the sweep width comes from on the search-effort screen. */
export type SweepSource = 'table' | 'width' | 'curve';

/** The form as typed: text fields stay text until the request is built, lengths in the form's `units`. */
export interface SearchEffortValues {
  /** The unit system the lengths are typed in (see {@link searchUnits}). */
  units: UnitSystem;
  source: SweepSource;
  tableId: string;
  /** Index of the chosen row in the table, as text ('' = none). */
  rowIndex: string;
  sweepWidth: string;
  model: SweepModel;
  /** One "range, POD" pair a line, the range in the distance unit of `units`. */
  curve: string;
  trackSpacing: string;
}

export type SearchEffortField = 'tableId' | 'rowIndex' | 'sweepWidth' | 'model' | 'curve' | 'trackSpacing';

export const SEARCH_EFFORT_DEFAULTS: SearchEffortValues = {
  units: 'metric',
  source: 'table',
  tableId: '',
  rowIndex: '',
  sweepWidth: '',
  model: 'inverse-cube',
  curve: '',
  trackSpacing: '',
};

/** The units of the search-effort fields: sweep widths, spacings, ranges and visibilities, and heights of eye. */
export interface SearchUnits {
  readonly distance: LengthUnit;
  readonly height: LengthUnit;
}

/**
 * The units search-effort lengths are typed in for a unit system: nautical
 * miles (feet for heights) in the nautical system, as sea search planners
 * work; statute miles and feet in the imperial one; metres throughout in the
 * metric one — sweep-width tables print metric widths and spacings in metres
 * (a person in the water: a few hundred metres), and a planner's "2000" has
 * always meant metres here.
 */
export function searchUnits(system: UnitSystem): SearchUnits {
  return system === 'metric'
    ? { distance: 'm', height: 'm' }
    : { distance: UNIT_SYSTEMS[system].distance, height: UNIT_SYSTEMS[system].height };
}

/** Example ranges of a curve line by unit (the nearest round figure to 500 m). */
const CURVE_EXAMPLE: Partial<Record<LengthUnit, string>> = { m: '500', km: '0.5', nmi: '0.3', mi: '0.3', ft: '1600' };

/**
 * Reads a lateral-range curve typed one point a line, "range, POD" (a
 * semicolon, tab or spaces also separate; decimals with a point; a POD may
 * be given in %), the ranges in `unit` (default metres).
 *
 * @returns the points, ranges in metres, or the first line that cannot be read (naming the unit it is read in)
 */
export function parseCurveText(
  text: string,
  unit: LengthUnit = 'm',
): { points: { rangeM: number; pod: number }[] } | { error: string } {
  const points: { rangeM: number; pod: number }[] = [];
  const lines = text.split(/\r?\n/);
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i]!.trim();
    if (line === '') continue;
    const parts = line.split(/[\s;,]+/).filter(Boolean);
    const [range, pod] = parts;
    const percent = pod?.endsWith('%');
    const rangeTyped = Number(range);
    const podValue = Number(percent ? pod!.slice(0, -1) : pod) / (percent ? 100 : 1);
    if (parts.length !== 2 || !Number.isFinite(rangeTyped) || !Number.isFinite(podValue)) {
      return {
        error: `Line ${i + 1}: write “range in ${LENGTH_UNIT_WORDS[unit]}, POD”, e.g. “${CURVE_EXAMPLE[unit] ?? '1'}, 0.6”.`,
      };
    }
    points.push({ rangeM: convertLength(rangeTyped, unit, 'm'), pod: podValue });
  }
  return { points };
}

/**
 * A typed curve re-typed in another unit (a unit switch): each line's range
 * converted, rounded as typed (see `retypeLength`); the POD and any line that
 * cannot be read are left as they are.
 */
export function retypeCurve(text: string, from: LengthUnit, to: LengthUnit): string {
  if (from === to) return text;
  return text.replace(
    /^(\s*)([-+]?\d+(?:\.\d+)?)(?=[\s;,])/gm,
    (_, lead: string, range: string) => lead + retypeLength(range, from, to),
  );
}

/** The column heads of a typed table row in `units`, for hints and errors. */
export const tableRowHeads = (units: SearchUnits): string =>
  `search object; visibility ${units.distance}; height ${units.height}; sweep width ${units.distance}`;

/**
 * Reads table rows typed one a line, "search object; visibility; height;
 * sweep width" (semicolons or tabs between the four, so the object's name
 * may hold commas), visibility and sweep width in `units.distance`, height in
 * `units.height` (default metres).
 *
 * @returns the rows in metres (numbers unchecked: the shared schema checks them), or the first line that cannot be read
 */
export function parseTableRowsText(
  text: string,
  units: SearchUnits = { distance: 'm', height: 'm' },
): { rows: { searchObject: string; visibilityM: number; heightM: number; sweepWidthM: number }[] } | { error: string } {
  const rows: { searchObject: string; visibilityM: number; heightM: number; sweepWidthM: number }[] = [];
  const lines = text.split(/\r?\n/);
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i]!.trim();
    if (line === '') continue;
    const parts = line.split(/\s*[;\t]\s*/);
    const [searchObject, ...numbers] = parts;
    const [visibility, height, sweepWidth] = numbers.map((n) => Number(n.replace(',', '.')));
    if (parts.length !== 4 || [visibility, height, sweepWidth].some((n) => !Number.isFinite(n))) {
      return { error: `Line ${i + 1}: write “${tableRowHeads(units)}”.` };
    }
    rows.push({
      searchObject: searchObject!,
      visibilityM: convertLength(visibility!, units.distance, 'm'),
      heightM: convertLength(height!, units.height, 'm'),
      sweepWidthM: convertLength(sweepWidth!, units.distance, 'm'),
    });
  }
  return { rows };
}

/**
 * Typed table rows re-typed in other units (a unit switch): visibility and
 * sweep width in the new distance unit, height in the new height unit; names
 * and anything that is not a number are left as typed.
 */
export function retypeTableRows(text: string, from: SearchUnits, to: SearchUnits): string {
  if (from.distance === to.distance && from.height === to.height) return text;
  return text
    .split(/(\r?\n)/)
    .map((line) => {
      const parts = line.split(/(\s*[;\t]\s*)/);
      // parts: name, sep, visibility, sep, height, sep, sweep width
      if (parts.length !== 7) return line;
      const units: [number, LengthUnit, LengthUnit][] = [
        [2, from.distance, to.distance],
        [4, from.height, to.height],
        [6, from.distance, to.distance],
      ];
      for (const [i, a, b] of units) parts[i] = retypeLength(parts[i]!, a, b);
      return parts.join('');
    })
    .join('');
}

/** Where a table row's error is, in the form's words, with the figures in the unit of its column. */
export function tableRowMessage(path: readonly PropertyKey[], message: string, units: SearchUnits): string {
  const [, index, key] = path;
  const unit = key === 'heightM' ? units.height : units.distance;
  const where = typeof index === 'number' ? `Line ${index + 1}${key ? ` (${String(key)})` : ''}: ` : '';
  return `${where}${key ? restateLengths(message, unit) : message}`;
}

/** Which form field shows an API field error (`lateralRangeCurve.2.rangeM` → the curve). */
export function formFieldOf(apiPath: string, source: SweepSource): SearchEffortField | null {
  if (apiPath === 'trackSpacingM') return 'trackSpacing';
  if (apiPath.startsWith('lateralRangeCurve')) return 'curve';
  if (apiPath === 'sweepWidthM') return source === 'table' ? 'rowIndex' : 'sweepWidth';
  if (apiPath === 'model') return 'model';
  return null;
}

/** Says which point of the curve an API path names, in the words of the form. */
const curvePointMessage = (apiPath: string, message: string) => {
  const m = /^lateralRangeCurve\.(\d+)/.exec(apiPath);
  return m ? `Point ${Number(m[1]) + 1}: ${message}` : message;
};

/** A typed length in `unit` as metres for the request ('' → left out; not a number → as typed, for the schema to refuse). */
const metresOf = (text: string, unit: LengthUnit) => typedToMetres(text, unit) ?? undefined;

/**
 * Builds the `POST /api/v1/sweep-width` request from the form, lengths typed
 * in the form's units turned into metres and checked with the shared schema;
 * or the errors per form field (a curve's figures restated in the unit its
 * ranges are typed in; the single-length fields restate their own).
 */
export function toSweepRequest(
  values: SearchEffortValues,
  tables: readonly SweepWidthTable[],
): { request: SweepWidthRequest } | { errors: Partial<Record<SearchEffortField, string>> } {
  const errors: Partial<Record<SearchEffortField, string>> = {};
  const { distance } = searchUnits(values.units ?? 'metric');
  const body: Record<string, unknown> = { trackSpacingM: metresOf(values.trackSpacing, distance) };
  if (values.source === 'table') {
    const table = tables.find((t) => t.id === values.tableId);
    const row = table?.rows[Number(values.rowIndex)];
    if (!table) errors.tableId = 'Choose a sweep-width table.';
    else if (values.rowIndex === '' || !row) errors.rowIndex = 'Choose a row of the table.';
    else body.sweepWidthM = row.sweepWidthM;
    body.model = values.model;
  } else if (values.source === 'width') {
    body.sweepWidthM = metresOf(values.sweepWidth, distance);
    body.model = values.model;
  } else {
    const curve = parseCurveText(values.curve, distance);
    if ('error' in curve) errors.curve = curve.error;
    else body.lateralRangeCurve = curve.points;
  }
  const parsed = SweepWidthRequestSchema.safeParse(body);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const path = issue.path.join('.');
      const field = formFieldOf(path, values.source);
      // Without a chosen row the missing sweep width is already said by the table or row error.
      if (path === 'sweepWidthM' && (errors.tableId || errors.rowIndex)) continue;
      if (field && !errors[field]) {
        errors[field] = field === 'curve' ? restateLengths(curvePointMessage(path, issue.message), distance) : issue.message;
      }
    }
  }
  if (Object.keys(errors).length > 0 || !parsed.success) {
    return { errors: Object.keys(errors).length ? errors : { trackSpacing: 'Check the values.' } };
  }
  return { request: parsed.data };
}

/**
 * The search-effort form's react-hook-form resolver: {@link toSweepRequest}
 * on the values as typed, with the tables given as the form's `context`, so the submit handler
 * gets the request in metres and each error lands under its field.
 */
export function searchEffortResolver(): Resolver<SearchEffortValues, unknown, SweepWidthRequest> {
  return (values, context) => {
    // The form's context is the organisation's tables (react-hook-form hands it to the resolver).
    const built = toSweepRequest(values, (context as readonly SweepWidthTable[] | undefined) ?? []);
    if ('request' in built) return { values: built.request, errors: {} };
    return { values: {}, errors: fieldErrors(built.errors) };
  };
}

/** Messages per field as react-hook-form's errors. */
const fieldErrors = (messages: Partial<Record<string, string>>) =>
  Object.fromEntries(Object.entries(messages).map(([field, message]) => [field, { type: 'validate', message }]));

/** The sweep-width table form as typed: the rows as text, lengths in the form's `units`. */
export interface TableFormValues {
  units: UnitSystem;
  name: string;
  edition: string;
  sourceName: string;
  rows: string;
}

/**
 * The table form's resolver: rows read in the form's units (a line that
 * cannot be read is named, with the units it is read in), then the shared
 * table schema; its row errors name the line and restate figures in the
 * unit of their column.
 */
export function tableFormResolver(): Resolver<TableFormValues, unknown, SweepWidthTableInput> {
  return (values) => {
    const units = searchUnits(values.units ?? 'metric');
    const rows = parseTableRowsText(values.rows, units);
    if ('error' in rows) return { values: {}, errors: fieldErrors({ rows: rows.error }) };
    const { units: _units, ...rest } = values;
    const parsed = SweepWidthTableInputSchema.safeParse({ ...rest, rows: rows.rows });
    if (parsed.success) return { values: parsed.data, errors: {} };
    const messages: Partial<Record<keyof TableFormValues, string>> = {};
    for (const issue of parsed.error.issues) {
      const [field] = issue.path;
      if (field === 'rows') messages.rows ??= tableRowMessage(issue.path, issue.message, units);
      else if (field === 'name' || field === 'edition' || field === 'sourceName') messages[field] ??= issue.message;
    }
    return { values: {}, errors: fieldErrors(messages) };
  };
}

/**
 * A table row in words, lengths in the person's distance and height units:
 * "Person in the water · visibility 5 km · height 10 m → W 300 m"
 * (metric), "… · visibility 2.7 nmi · height 32.8 ft → W 0.16 nmi" (nautical).
 */
export function describeRow(row: SweepWidthTable['rows'][number], system: UnitSystem = 'metric'): string {
  const { distance, height } = UNIT_SYSTEMS[system];
  const vis = distanceIn(row.visibilityM, distance, (m) => (m >= 1000 ? `${+(m / 1000).toFixed(1)} km` : `${m} m`));
  const h = lengthIn(row.heightM, height);
  return `${row.searchObject} · visibility ${vis} · height ${h} → W ${formatSweepDistance(row.sweepWidthM, system)}`;
}

/**
 * A sweep width or track spacing for people in a unit system: metric "850 m",
 * "2.4 km"; nautical miles in the nautical system ("0.46 nmi": how sea search
 * planners give W and S), statute miles in the imperial one, each to two
 * decimals below 10 (one to 100), and in feet when under a tenth of a
 * mile (0.05 nmi) so short widths do not read "0 mi".
 */
export function formatSweepDistance(metres: number, system: UnitSystem = 'metric'): string {
  return distanceIn(metres, UNIT_SYSTEMS[system].distance, formatMetres);
}

/** Metres for people: "850 m", "2.4 km". */
export function formatMetres(m: number): string {
  return m >= 1000 ? `${+(m / 1000).toFixed(2)} km` : `${Math.round(m)} m`;
}
