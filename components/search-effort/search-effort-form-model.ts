import {
  SweepWidthRequestSchema,
  type SweepModel,
  type SweepWidthRequest,
  type SweepWidthTable,
} from '@/shared/schemas/sweep-width';

/** Where the sweep width comes from on the search-effort screen. */
export type SweepSource = 'table' | 'width' | 'curve';

/** The form as typed: text fields stay text until the request is built. */
export interface SearchEffortValues {
  source: SweepSource;
  tableId: string;
  /** Index of the chosen row in the table, as text ('' = none). */
  rowIndex: string;
  sweepWidth: string;
  model: SweepModel;
  /** One "range m, POD" pair a line. */
  curve: string;
  trackSpacing: string;
}

export type SearchEffortField = 'tableId' | 'rowIndex' | 'sweepWidth' | 'model' | 'curve' | 'trackSpacing';

export const SEARCH_EFFORT_DEFAULTS: SearchEffortValues = {
  source: 'table',
  tableId: '',
  rowIndex: '',
  sweepWidth: '',
  model: 'inverse-cube',
  curve: '',
  trackSpacing: '',
};

const numberOf = (text: string) => (text.trim() === '' ? undefined : Number(text.trim().replace(',', '.')));

/**
 * Reads a lateral-range curve typed one point a line, "range, POD" (a
 * semicolon, tab or spaces also separate; decimals with a point; a POD may
 * be given in %).
 *
 * @returns the points, or the first line that cannot be read
 */
export function parseCurveText(text: string): { points: { rangeM: number; pod: number }[] } | { error: string } {
  const points: { rangeM: number; pod: number }[] = [];
  const lines = text.split(/\r?\n/);
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i]!.trim();
    if (line === '') continue;
    const parts = line.split(/[\s;,]+/).filter(Boolean);
    const [range, pod] = parts;
    const percent = pod?.endsWith('%');
    const rangeM = Number(range);
    const podValue = Number(percent ? pod!.slice(0, -1) : pod) / (percent ? 100 : 1);
    if (parts.length !== 2 || !Number.isFinite(rangeM) || !Number.isFinite(podValue)) {
      return { error: `Line ${i + 1}: write “range in metres, POD”, e.g. “500, 0.6”.` };
    }
    points.push({ rangeM, pod: podValue });
  }
  return { points };
}

/**
 * Reads table rows typed one a line, "search object; visibility m; height m;
 * sweep width m" (semicolons or tabs between the four, so the object's name
 * may hold commas).
 *
 * @returns the rows (numbers unchecked: the shared schema checks them), or the first line that cannot be read
 */
export function parseTableRowsText(
  text: string,
): { rows: { searchObject: string; visibilityM: number; heightM: number; sweepWidthM: number }[] } | { error: string } {
  const rows: { searchObject: string; visibilityM: number; heightM: number; sweepWidthM: number }[] = [];
  const lines = text.split(/\r?\n/);
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i]!.trim();
    if (line === '') continue;
    const parts = line.split(/\s*[;\t]\s*/);
    const [searchObject, ...numbers] = parts;
    const [visibilityM, heightM, sweepWidthM] = numbers.map((n) => Number(n.replace(',', '.')));
    if (parts.length !== 4 || [visibilityM, heightM, sweepWidthM].some((n) => !Number.isFinite(n))) {
      return { error: `Line ${i + 1}: write “search object; visibility m; height m; sweep width m”.` };
    }
    rows.push({ searchObject: searchObject!, visibilityM: visibilityM!, heightM: heightM!, sweepWidthM: sweepWidthM! });
  }
  return { rows };
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

/**
 * Builds the `POST /api/v1/sweep-width` request from the form, checked with
 * the shared schema; or the errors per form field.
 */
export function toSweepRequest(
  values: SearchEffortValues,
  tables: readonly SweepWidthTable[],
): { request: SweepWidthRequest } | { errors: Partial<Record<SearchEffortField, string>> } {
  const errors: Partial<Record<SearchEffortField, string>> = {};
  const body: Record<string, unknown> = { trackSpacingM: numberOf(values.trackSpacing) };
  if (values.source === 'table') {
    const table = tables.find((t) => t.id === values.tableId);
    const row = table?.rows[Number(values.rowIndex)];
    if (!table) errors.tableId = 'Choose a sweep-width table.';
    else if (values.rowIndex === '' || !row) errors.rowIndex = 'Choose a row of the table.';
    else body.sweepWidthM = row.sweepWidthM;
    body.model = values.model;
  } else if (values.source === 'width') {
    body.sweepWidthM = numberOf(values.sweepWidth);
    body.model = values.model;
  } else {
    const curve = parseCurveText(values.curve);
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
      if (field && !errors[field]) errors[field] = curvePointMessage(path, issue.message);
    }
  }
  if (Object.keys(errors).length > 0 || !parsed.success) {
    return { errors: Object.keys(errors).length ? errors : { trackSpacing: 'Check the values.' } };
  }
  return { request: parsed.data };
}

/** A table row in words: "Person in the water · visibility 5 km · height 10 m → W 300 m". */
export function describeRow(row: SweepWidthTable['rows'][number]): string {
  const vis = row.visibilityM >= 1000 ? `${+(row.visibilityM / 1000).toFixed(1)} km` : `${row.visibilityM} m`;
  return `${row.searchObject} · visibility ${vis} · height ${row.heightM} m → W ${formatMetres(row.sweepWidthM)}`;
}

/** Metres for people: "850 m", "2.4 km". */
export function formatMetres(m: number): string {
  return m >= 1000 ? `${+(m / 1000).toFixed(2)} km` : `${Math.round(m)} m`;
}
