import type { PlanSnapshot } from '@/shared/schemas/plan';
import type { RefractionCondition } from '@/shared/schemas/sightline';
import { conditionLabel } from '../coverage/coverage-inputs';

/** A column of the results file: its header (unit in the name) and how a row fills it. */
interface Column {
  readonly header: string;
  readonly value: (row: PlanSnapshot['results'][number], context: RowContext) => string | number | boolean | null;
  /** Free text typed by people (names): guarded against spreadsheet formulas. */
  readonly text?: boolean;
}

interface RowContext {
  readonly conditionLabel: string;
  readonly conditionSetVisibilityM: number | null;
}

/**
 * The columns of `results.csv`, one row per post × target × condition. Every
 * quantity carries its unit in its header (`_m` metres, `_deg` degrees;
 * `refraction_k` is dimensionless); an empty field is "not applicable or not
 * known" (e.g. no visibility stated, a duct's horizon).
 */
export const RESULTS_CSV_COLUMNS: readonly Column[] = [
  { header: 'post_id', value: (r) => r.postId },
  { header: 'post_name', value: (r) => r.postName, text: true },
  { header: 'target_id', value: (r) => r.targetId },
  { header: 'target_name', value: (r) => r.targetName, text: true },
  { header: 'condition_set_id', value: (r) => r.conditionSetId },
  { header: 'condition_set_name', value: (r) => r.conditionSetName, text: true },
  { header: 'condition_index', value: (r) => r.conditionIndex },
  { header: 'condition_label', value: (_r, c) => c.conditionLabel, text: true },
  { header: 'refraction_k', value: (r) => r.result.k },
  { header: 'refraction_regime', value: (r) => r.result.regime },
  { header: 'visibility_m', value: (_r, c) => c.conditionSetVisibilityM },
  { header: 'datum_ground_m', value: (r) => r.datum?.groundM ?? null },
  { header: 'datum_basis', value: (r) => r.datum?.basis ?? null },
  { header: 'height_of_eye_m', value: (r) => r.observerHeightM },
  { header: 'effective_earth_radius_m', value: (r) => r.result.effectiveRadiusM },
  { header: 'horizon_range_m', value: (r) => r.result.horizonDistanceM },
  { header: 'dip_deg', value: (r) => r.result.dipDeg },
  { header: 'geographic_range_m', value: (r) => r.result.geographicRangeM },
  { header: 'visibility_limit_m', value: (r) => r.result.visibilityLimitM },
  { header: 'angular_size_limit_m', value: (r) => r.result.angularSizeLimitM },
  { header: 'luminous_range_m', value: (r) => r.result.luminousRangeM },
  { header: 'wave_screen_m', value: (r) => r.result.waveScreenM },
  { header: 'detection_range_m', value: (r) => r.result.detectionRangeM },
  { header: 'limiting_factor', value: (r) => r.result.limitedBy },
  { header: 'detection_range_band_min_m', value: (r) => r.sensitivity?.detectionRangeM?.min ?? null },
  { header: 'detection_range_band_max_m', value: (r) => r.sensitivity?.detectionRangeM?.max ?? null },
  { header: 'warnings', value: (r) => r.result.warnings.map((w) => w.code).join(' '), text: true },
];

/** Characters that make a spreadsheet read a cell as a formula (OWASP, "CSV Injection"). */
const FORMULA_START = /^[=+\-@\t\r]/;

/** Metres and degrees to the millimetre / millionth of a degree; other numbers as they are. */
const formatNumber = (value: number) => (Number.isInteger(value) ? String(value) : String(Math.round(value * 1e6) / 1e6));

/**
 * One field of RFC 4180: enclosed in double quotes when it holds a comma, a
 * double quote, CR or LF, with every double quote doubled.
 *
 * Source: RFC 4180 §2 rules 5–7.
 */
export function csvField(raw: string): string {
  return /[",\r\n]/.test(raw) ? `"${raw.replace(/"/g, '""')}"` : raw;
}

function fieldOf(value: string | number | boolean | null, text: boolean): string {
  if (value === null) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? formatNumber(value) : '';
  const s = String(value);
  // A name typed as "=HYPERLINK(…)" must stay text in a spreadsheet: a leading apostrophe (OWASP).
  return csvField(text && FORMULA_START.test(s) ? `'${s}` : s);
}

/**
 * The frozen results of a plan revision as CSV: a header line, then one line
 * per post × target × condition in the snapshot's order. Lines end in CRLF,
 * fields are quoted only when they must be, and the file starts without a
 * byte-order mark.
 *
 * Source: RFC 4180 (Common Format and MIME Type for CSV Files), §2.
 *
 * @param snapshot a frozen revision's snapshot (not modified)
 * @returns the file's text
 * @example
 * resultsCsv(revision.snapshot).split('\r\n')[0]; // "post_id,post_name,…,horizon_range_m,…"
 */
export function resultsCsv(snapshot: PlanSnapshot): string {
  const sets = new Map(
    snapshot.inputs.conditionSets.map((s) => [
      String(s.id),
      {
        conditions: (s.conditions ?? []) as RefractionCondition[],
        visibilityM: typeof s.visibilityM === 'number' ? s.visibilityM : null,
      },
    ]),
  );
  const lines = [RESULTS_CSV_COLUMNS.map((c) => c.header).join(',')];
  for (const row of snapshot.results) {
    const set = sets.get(row.conditionSetId);
    const condition = set?.conditions[row.conditionIndex];
    const context: RowContext = {
      conditionLabel: condition ? conditionLabel(condition, row.result.k) : `k = ${row.result.k}`,
      conditionSetVisibilityM: set?.visibilityM ?? null,
    };
    lines.push(RESULTS_CSV_COLUMNS.map((c) => fieldOf(c.value(row, context), c.text ?? false)).join(','));
  }
  return lines.join('\r\n') + '\r\n';
}
