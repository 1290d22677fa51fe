import type { IncidentEntry, IncidentStatus, SightingKind } from '@/shared/schemas/incident';

/** What was seen, as people say it. */
export const SIGHTING_LABELS: Record<SightingKind, string> = {
  smoke: 'Smoke',
  light: 'Light',
  vessel: 'Vessel',
  person: 'Person',
  other: 'Something else',
};

export const STATUS_LABELS: Record<IncidentStatus, string> = { open: 'Open', closed: 'Closed' };

/** The standing cautions beside every fix: a missed or misplaced smoke can hurt someone. */
export const INCIDENT_CAUTIONS = [
  'A fix is an estimate only: it is as good as the bearings, the posts’ positions and the declination used.',
  'Refraction near the horizon varies widely; a smoke low on the horizon may show where it is not, or not at all.',
  'Visibility is not detection. Follow your agency’s procedures for confirming a fix and sending anyone to it.',
] as const;

/** Degrees to one decimal with the sign spelled as east or west (declination). */
export function eastWest(deg: number): string {
  const a = Math.abs(deg).toFixed(1);
  return deg === 0 ? '0.0°' : `${a}° ${deg > 0 ? 'E' : 'W'}`;
}

/** A bearing as people write it: three digits and a decimal, e.g. "047.5°". */
export function bearingText(deg: number): string {
  const d = ((deg % 360) + 360) % 360;
  const [whole, tenth] = d.toFixed(1).split('.');
  return `${whole!.padStart(3, '0')}.${tenth}°`;
}

/** An area in m² as km² or hectares, whichever reads better. */
export function areaText(m2: number): string {
  if (m2 >= 1e6) return `${(m2 / 1e6).toLocaleString('en', { maximumFractionDigits: 2 })} km²`;
  return `${(m2 / 1e4).toLocaleString('en', { maximumFractionDigits: m2 >= 1e5 ? 1 : 2 })} ha`;
}

/** One log line in words (its kind and what it says). */
export function entrySummary(entry: IncidentEntry): { title: string; detail: string } {
  const b = entry.body;
  const text = (k: string) => (typeof b[k] === 'string' ? (b[k] as string) : '');
  const num = (k: string) => (typeof b[k] === 'number' ? (b[k] as number) : null);
  switch (entry.kind) {
    case 'opened':
      return { title: 'Opened', detail: text('title') };
    case 'updated':
      return { title: 'Renamed', detail: `${text('previousTitle')} → ${text('title')}` };
    case 'closed':
      return { title: 'Closed', detail: text('note') };
    case 'reopened':
      return { title: 'Reopened', detail: text('note') };
    case 'report': {
      const trueDeg = num('trueBearingDeg');
      const kind = text('kind') as SightingKind;
      return {
        title: `Bearing from ${text('postName')}`,
        detail: [
          trueDeg === null ? '' : `${bearingText(trueDeg)} true ± ${num('bearingSigmaDeg') ?? '?'}°`,
          SIGHTING_LABELS[kind] ?? '',
          text('note'),
        ]
          .filter(Boolean)
          .join(' · '),
      };
    }
    case 'fix': {
      if ('problem' in b) return { title: 'No fix', detail: text('problem') };
      const fix = b.fix as { fromReports?: number[] } | undefined;
      return { title: 'Fix', detail: `From ${fix?.fromReports?.length ?? 0} bearings` };
    }
  }
}
