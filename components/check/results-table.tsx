import { StyleSheet, View } from 'react-native';
import type { SightlineResult } from '@/shared/schemas/sightline';
import { horizonApproxRelativeError } from '@/shared/sightline/horizon-approx-relative-error';
import type { LengthUnit } from '@/shared/units/length';
import { AppText } from '@/components/ui/app-text';
import { tableStyles } from '@/components/ui/table-styles';
import { colors } from '@/components/ui/theme';
import type { ConditionLabel } from './check-form-model';
import { formatAngle, formatLength, LIMIT_LABELS, REGIME_LABELS } from './format';
import { HorizontalScrollCue } from '@/components/ui/scroll-cue';

interface Row {
  label: string;
  hint?: string;
  cell: (r: SightlineResult) => string;
  strong?: boolean;
}

/** One column per condition; rows are the quantities. Scrolls sideways on a phone. */
export function ResultsTable({
  results,
  labels,
  units,
  observerHeightM,
  earthRadiusM,
}: {
  results: SightlineResult[];
  labels: ConditionLabel[];
  units: { height: LengthUnit; distance: LengthUnit };
  observerHeightM: number;
  earthRadiusM?: number;
}) {
  const rows: Row[] = [
    { label: 'k · regime', cell: (r) => `${r.k.toFixed(3)} · ${REGIME_LABELS[r.regime]}` },
    { label: 'Effective radius', hint: 'R / (1 − k)', cell: (r) => formatLength(r.effectiveRadiusM, 'km') },
    { label: 'Horizon distance', hint: 'along the surface', cell: (r) => formatLength(r.horizonDistanceM, units.distance) },
    { label: 'Tangent length', hint: 'straight, eye to horizon', cell: (r) => formatLength(r.tangentLengthM, units.distance) },
    { label: 'Dip of the horizon', hint: 'below eye level', cell: (r) => formatAngle(r.dipDeg) },
    {
      label: 'Hidden height',
      hint: 'at the target distance',
      cell: (r) => formatLength(r.hiddenHeightM, units.height),
      strong: true,
    },
    { label: 'Visible part', hint: 'of the target', cell: (r) => formatLength(r.visibleHeightM, units.height) },
    {
      label: 'Geographic range',
      hint: 'eye horizon + target-top horizon',
      cell: (r) => formatLength(r.geographicRangeM, units.distance),
    },
    {
      label: 'Detection range',
      hint: 'least of the limits',
      strong: true,
      cell: (r) =>
        r.detectionRangeM === null
          ? '—'
          : `${formatLength(r.detectionRangeM, units.distance)} (${r.limitedBy ? LIMIT_LABELS[r.limitedBy] : '—'})`,
    },
    ...(results.some((r) => r.luminousRangeM !== null)
      ? [
          {
            label: 'Luminous range',
            hint: 'of the light, Allard’s law',
            cell: (r: SightlineResult) => formatLength(r.luminousRangeM, units.distance),
          },
        ]
      : []),
    ...(results.some((r) => r.waveScreenM > 0)
      ? [
          {
            label: 'Wave screen',
            hint: 'crests hide the lowest',
            cell: (r: SightlineResult) => formatLength(r.waveScreenM, units.height),
          },
        ]
      : []),
    {
      label: '√(2R′h) error',
      hint: 'short formula vs exact',
      cell: (r) => {
        const e = horizonApproxRelativeError(observerHeightM, { k: r.k, earthRadiusM });
        return e.value === null ? '—' : `${(e.value * 100).toPrecision(2)} %`;
      },
    },
  ];
  return (
    <HorizontalScrollCue label="conditions">
      <View style={styles.table} role="table" aria-label="Sightline results">
        <View style={[styles.tr, styles.head]} role="row">
          <View style={[styles.th, styles.labelCol]} role="columnheader">
            <AppText variant="label" tone="muted">
              Quantity
            </AppText>
          </View>
          {labels.map((l) => (
            <View key={l.key} style={styles.th} role="columnheader">
              <AppText variant="label">{l.label}</AppText>
            </View>
          ))}
        </View>
        {rows.map((row) => (
          <View key={row.label} style={styles.tr} role="row">
            <View style={[styles.td, styles.labelCol]} role="rowheader">
              <AppText variant="label">{row.label}</AppText>
              {row.hint ? (
                <AppText variant="small" tone="muted">
                  {row.hint}
                </AppText>
              ) : null}
            </View>
            {results.map((r, i) => (
              <View key={labels[i]?.key ?? i} style={styles.td} role="cell">
                <AppText variant={row.strong ? 'heading' : 'body'} style={{ fontVariant: ['tabular-nums'] }}>
                  {row.cell(r)}
                </AppText>
              </View>
            ))}
          </View>
        ))}
      </View>
    </HorizontalScrollCue>
  );
}

const styles = {
  ...tableStyles,
  ...StyleSheet.create({
    th: { ...tableStyles.th, width: 150 },
    td: { ...tableStyles.td, width: 150 },
    labelCol: { width: 150, borderRightWidth: 1, borderRightColor: colors.line },
  }),
};
