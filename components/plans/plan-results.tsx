import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { PlanResultRow, PlanSnapshot, ZoneReach } from '@/shared/schemas/plan';
import { UNIT_SYSTEMS, type UnitSystem } from '@/shared/units/unit-systems';
import { useUnitSystem } from '@/components/data/session';
import { formatLength, LIMIT_LABELS } from '@/components/check/format';
import { describeCondition } from '@/components/library/describe-condition';
import { bandLines, datumLine } from './result-band';
import { AppText } from '@/components/ui/app-text';
import { tableStyles } from '@/components/ui/table-styles';
import { Card } from '@/components/ui/card';
import { Chip, ChipRow } from '@/components/ui/chip';
import { EmptyState } from '@/components/ui/states';
import { colors, radius, space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { HorizontalScrollCue } from '@/components/ui/scroll-cue';

type SortKey = 'post' | 'range-asc' | 'range-desc';

const REACH: Record<ZoneReach['reach'], { label: string; fg: string; bg: string }> = {
  whole: { label: 'whole zone', fg: colors.moss, bg: colors.mossSoft },
  part: { label: 'part', fg: colors.ink, bg: colors.cautionSoft },
  none: { label: 'out of reach', fg: colors.danger, bg: colors.dangerSoft },
  unknown: { label: 'no range', fg: colors.muted, bg: colors.paper },
};

/** Labels of a result line's condition: the set's name and the condition itself. */
function conditionLabels(snapshot: PlanSnapshot) {
  const sets = new Map(snapshot.inputs.conditionSets.map((s) => [String(s.id), s]));
  return (row: PlanResultRow) => {
    const set = sets.get(row.conditionSetId);
    const cond = (set?.conditions as Record<string, number | string>[] | undefined)?.[row.conditionIndex];
    return cond ? describeCondition(cond) : `k = ${row.result.k.toFixed(3)}`;
  };
}

const toggle = (set: Set<string>, id: string) => {
  const next = new Set(set);
  if (next.has(id)) next.delete(id);
  else next.add(id);
  return next;
};

/**
 * Every post × target × condition of a plan: detection range, the limit that
 * sets it, and how much of each priority zone it reaches. Filter by post,
 * target or condition set; sort by post or by range. A table on wide
 * screens, cards on a phone.
 */
/** `units`: the plan site's default units; the person's own choice (account page) wins. */
export function PlanResults({ snapshot, units = 'metric' }: { snapshot: PlanSnapshot; units?: UnitSystem }) {
  const { wide } = useLayout();
  const system = useUnitSystem(units);
  const [posts, setPosts] = useState<Set<string>>(new Set());
  const [targets, setTargets] = useState<Set<string>>(new Set());
  const [sets, setSets] = useState<Set<string>>(new Set());
  const [sort, setSort] = useState<SortKey>('post');
  const u = UNIT_SYSTEMS[system];
  const conditionOf = useMemo(() => conditionLabels(snapshot), [snapshot]);

  const options = (key: 'postId' | 'targetId' | 'conditionSetId', name: 'postName' | 'targetName' | 'conditionSetName') => [
    ...new Map(snapshot.results.map((r) => [r[key], r[name]])).entries(),
  ];
  const rows = useMemo(() => {
    const kept = snapshot.results.filter(
      (r) =>
        (posts.size === 0 || posts.has(r.postId)) &&
        (targets.size === 0 || targets.has(r.targetId)) &&
        (sets.size === 0 || sets.has(r.conditionSetId)),
    );
    if (sort === 'post') return kept;
    const range = (r: PlanResultRow) => r.result.detectionRangeM ?? (sort === 'range-asc' ? Infinity : -Infinity);
    return [...kept].sort((a, b) => (sort === 'range-asc' ? range(a) - range(b) : range(b) - range(a)));
  }, [snapshot.results, posts, targets, sets, sort]);

  if (snapshot.results.length === 0) {
    return <EmptyState title="No results" body="Choose at least one post, target and condition set." />;
  }
  const zoneNames = snapshot.results[0]?.zones.map((z) => z.name) ?? [];

  return (
    <View style={{ gap: space.md }}>
      <View style={wide ? { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.xl, rowGap: space.sm } : { gap: space.sm }}>
        <ChipRow label="Posts">
          {options('postId', 'postName').map(([id, name]) => (
            <Chip key={id} label={name} on={posts.has(id)} onPress={() => setPosts((s) => toggle(s, id))} />
          ))}
        </ChipRow>
        <ChipRow label="Targets">
          {options('targetId', 'targetName').map(([id, name]) => (
            <Chip key={id} label={name} on={targets.has(id)} onPress={() => setTargets((s) => toggle(s, id))} />
          ))}
        </ChipRow>
        <ChipRow label="Condition sets">
          {options('conditionSetId', 'conditionSetName').map(([id, name]) => (
            <Chip key={id} label={name} on={sets.has(id)} onPress={() => setSets((s) => toggle(s, id))} />
          ))}
        </ChipRow>
        <ChipRow label="Order">
          <Chip label="By post" on={sort === 'post'} onPress={() => setSort('post')} />
          <Chip label="Shortest range first" on={sort === 'range-asc'} onPress={() => setSort('range-asc')} />
          <Chip label="Longest range first" on={sort === 'range-desc'} onPress={() => setSort('range-desc')} />
        </ChipRow>
        <AppText variant="small" tone="muted" style={{ width: '100%' }}>
          {rows.length} of {snapshot.results.length} lines
          {posts.size + targets.size + sets.size > 0 ? ' · filters on' : ''}
        </AppText>
      </View>

      {wide ? (
        <HorizontalScrollCue label="columns">
          <View style={styles.table} role="table" aria-label="Plan results">
            <View style={[styles.tr, styles.head]} role="row">
              {['Post → target', 'Condition', 'Detection range', ...zoneNames].map((h, i) => (
                <View key={h} style={[styles.th, COLUMNS[Math.min(i, 3)]]} role="columnheader">
                  <AppText variant="label" tone="muted">
                    {i >= 3 ? `Zone: ${h}` : h}
                  </AppText>
                </View>
              ))}
            </View>
            {rows.map((r) => (
              <View key={`${r.postId}|${r.targetId}|${r.conditionSetId}|${r.conditionIndex}`} style={styles.tr} role="row">
                <Cell column={0} strong lines={[`→ ${r.targetName}`, datumLine(r, u.height)]}>
                  {r.postName}
                </Cell>
                <Cell column={1} lines={[conditionOf(r)]}>
                  {r.conditionSetName}
                </Cell>
                <Cell
                  column={2}
                  strong
                  lines={[
                    r.result.limitedBy ? `limit: ${LIMIT_LABELS[r.result.limitedBy]}` : 'no limit found',
                    `geographic ${formatLength(r.result.geographicRangeM, u.distance)}`,
                    ...bandLines(r, u.distance),
                  ]}
                >
                  {formatLength(r.result.detectionRangeM, u.distance)}
                </Cell>
                {r.zones.map((z) => (
                  <View key={z.name} style={[styles.td, COLUMNS[3]]} role="cell">
                    <ReachTag zone={z} />
                  </View>
                ))}
              </View>
            ))}
          </View>
        </HorizontalScrollCue>
      ) : (
        <View style={{ gap: space.sm }} role="list" aria-label="Plan results">
          {rows.map((r) => (
            <Card
              key={`${r.postId}|${r.targetId}|${r.conditionSetId}|${r.conditionIndex}`}
              role="listitem"
              style={{ gap: space.xs }}
            >
              <AppText variant="label">
                {r.postName} → {r.targetName}
              </AppText>
              <AppText variant="small" tone="muted">
                {r.conditionSetName} · {conditionOf(r)}
              </AppText>
              <AppText variant="small" tone="muted">
                {datumLine(r, u.height)}
              </AppText>
              <View style={{ flexDirection: 'row', alignItems: 'baseline', gap: space.sm, flexWrap: 'wrap' }}>
                <AppText variant="figure">{formatLength(r.result.detectionRangeM, u.distance)}</AppText>
                <AppText variant="small" tone="muted">
                  {r.result.limitedBy ? `limited by ${LIMIT_LABELS[r.result.limitedBy]}` : 'no limit found'} · geographic{' '}
                  {formatLength(r.result.geographicRangeM, u.distance)}
                </AppText>
              </View>
              {bandLines(r, u.distance).map((line) => (
                <AppText key={line} variant="small" tone="muted">
                  {line}
                </AppText>
              ))}
              {r.zones.length ? (
                <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.xs }}>
                  {r.zones.map((z) => (
                    <ReachTag key={z.name} zone={z} withName />
                  ))}
                </View>
              ) : null}
            </Card>
          ))}
        </View>
      )}
    </View>
  );
}

/** Column widths: flexible, with a floor below which the table scrolls sideways. */
const COLUMNS = [
  { flex: 3, minWidth: 200 },
  { flex: 3, minWidth: 190 },
  { flex: 2, minWidth: 150 },
  { flex: 2, minWidth: 130 },
] as const;

function Cell({
  column,
  strong,
  lines,
  children,
}: {
  column: number;
  strong?: boolean;
  lines: string[];
  children: React.ReactNode;
}) {
  return (
    <View style={[styles.td, COLUMNS[column]]} role="cell">
      <AppText variant={strong ? 'label' : 'body'} style={{ fontVariant: ['tabular-nums'] }}>
        {children}
      </AppText>
      {lines.map((l) => (
        <AppText key={l} variant="small" tone="muted">
          {l}
        </AppText>
      ))}
    </View>
  );
}

/** A priority zone's reach from one post: whole / part (with its share) / out of reach. */
function ReachTag({ zone, withName }: { zone: ZoneReach; withName?: boolean }) {
  const s = REACH[zone.reach];
  const share = zone.reach === 'part' && zone.coveredPct !== null ? ` ${zone.coveredPct.toFixed(0)} %` : '';
  return (
    <AppText
      variant="small"
      style={[styles.tag, { color: s.fg, backgroundColor: s.bg }]}
      aria-label={`${zone.name}: ${s.label}${share}`}
    >
      {withName ? `${zone.name}: ` : ''}
      {s.label}
      {share}
    </AppText>
  );
}

const styles = {
  ...tableStyles,
  ...StyleSheet.create({
    tag: {
      paddingHorizontal: space.sm,
      paddingVertical: 2,
      borderRadius: radius.pill,
      overflow: 'hidden',
      alignSelf: 'flex-start',
    },
  }),
};
