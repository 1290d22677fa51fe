import type { PlanResultRow } from '@/shared/schemas/plan';
import { GROUND_BASIS_WORDS } from '@/shared/plans/smooth-earth-ground';
import type { LengthUnit } from '@/shared/units/length';
import { formatLength, LIMIT_LABELS } from '@/components/check/format';

/**
 * The row's refraction band in words: "k 0–0.3: 21.6–25.8 km (horizon)",
 * or nothing for revisions made before bands were computed.
 */
export function bandLines(r: PlanResultRow, unit: LengthUnit): string[] {
  const band = r.sensitivity;
  if (!band?.detectionRangeM) return [];
  const { min, max } = band.detectionRangeM;
  const ks = `k ${band.ks[0]}–${band.ks[band.ks.length - 1]}`;
  const limits = band.limitedBy.map((l) => LIMIT_LABELS[l]).join(', ');
  if (max - min < 1e-6 * Math.max(1, max)) return [`${ks}: unchanged (${limits})`];
  return [`${ks}: ${formatLength(min, unit)} – ${formatLength(max, unit)} (${limits}; spread ${band.spreadPct!.toFixed(0)} %)`];
}

/** The row's datum in words: "eye 21.6 m above the post's own ground (578 m)"; older revisions: "above sea level". */
export function datumLine(r: PlanResultRow, unit: LengthUnit): string {
  const eye = `eye ${formatLength(r.observerHeightM, unit)}`;
  if (!r.datum) return `${eye} above sea level`;
  const ground = formatLength(r.datum.groundM, unit);
  return r.datum.basis === 'sea-level'
    ? `${eye} above sea level (${GROUND_BASIS_WORDS['sea-level']})`
    : `${eye} above ${r.datum.basis === 'stated' ? 'the site’s stated ground' : 'the post’s own ground'} at ${ground}`;
}
