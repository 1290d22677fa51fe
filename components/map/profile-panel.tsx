import { StyleSheet, View } from 'react-native';
import type { Post } from '@/shared/schemas/site';
import type { LengthUnit } from '@/shared/units/length';
import { restateLengths } from '@/shared/units/typed-lengths';
import { formatLength, lengthIn } from '@/components/check/format';
import { useLengthUnits } from '@/components/data/session';
import { useSite } from '@/components/data/sites';
import type { ProfileConditionResult, TerrainProfileRequest } from '@/shared/schemas/terrain';
import { refractionPreset, type RefractionPresetId } from '@/shared/sightline/refraction-presets';
import { CautionsPanel } from '@/components/check/cautions-panel';
import { conditionStyle } from '@/components/check/condition-colors';
import { useTerrainProfileFor } from '@/components/data/terrain';
import { AppText } from '@/components/ui/app-text';
import { Chip, ChipRow } from '@/components/ui/chip';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { colors, radius, space } from '@/components/ui/theme';
import { ProfileView } from './profile-view';

/** The refraction conditions the profile offers, in chip order (named presets of the sightline core). */
export const PROFILE_CONDITIONS: readonly { id: RefractionPresetId; short: string }[] = [
  { id: 'standard-optical', short: 'Standard optical' },
  { id: 'no-refraction', short: 'No refraction' },
  { id: 'sub-refraction-heated-ground', short: 'Sub-refraction' },
  { id: 'super-refraction-inversion', short: 'Super-refraction' },
];

/** Target heights offered: the ground itself, a person, a mast, a smoke column. */
export const PROFILE_TARGET_HEIGHTS: readonly { m: number; label: string }[] = [
  { m: 0, label: 'Ground' },
  { m: 2, label: '2 m (a person)' },
  { m: 10, label: '10 m' },
  { m: 30, label: '30 m (smoke)' },
];

/** The standing cautions, shown before any answer arrives (the API repeats them with each profile). */
const STANDING_CAUTIONS = [
  {
    code: 'estimates-only',
    message: 'Estimates only, from the terrain grid: trees, buildings and the grid’s own errors are not included.',
  },
  {
    code: 'refraction-varies',
    message: 'Refraction near the horizon varies widely; compare several conditions before relying on a line of sight.',
  },
  { code: 'visibility-not-detection', message: 'Visibility is not detection: a target in view can still be missed.' },
  { code: 'follow-procedures', message: 'Follow your agency’s procedures, local regulations and licensed practice.' },
];

const kmText = (m: number) => (m >= 1000 ? `${(m / 1000).toFixed(m >= 10_000 ? 1 : 2)} km` : `${Math.round(m)} m`);
const metresText = (m: number) => `${m.toLocaleString('en', { maximumFractionDigits: m >= 100 ? 0 : 1 })} m`;

/** The person's length units for the read-outs (metric unless given). */
export interface ReadoutUnits {
  height: LengthUnit;
  distance: LengthUnit;
}
const METRIC: ReadoutUnits = { height: 'm', distance: 'km' };

/** One condition's answer in words, heights and distances in `units`. */
export function verdictText(
  r: ProfileConditionResult,
  targetHeightM: number,
  units: ReadoutUnits = METRIC,
): { seen: boolean; text: string } {
  const km = (m: number) => (units.distance === 'km' ? kmText(m) : formatLength(m, units.distance));
  const metres = (m: number) => lengthIn(m, units.height, metresText);
  const block = r.firstObstruction ?? r.horizon;
  const where = block ? `, blocked by ground ${km(block.distanceM)} out` : '';
  if (targetHeightM > 0) {
    return r.targetTopSeen
      ? {
          seen: true,
          text: `Seen: the top of a ${metres(targetHeightM)} target shows${r.groundSeen ? ' (the ground too)' : ''}.`,
        }
      : {
          seen: false,
          text: `Not seen: a ${metres(targetHeightM)} target stays hidden${where}; it would need ${metres(r.hiddenHeightM)}.`,
        };
  }
  return r.groundSeen
    ? { seen: true, text: 'Seen: the ground at the point is in view.' }
    : { seen: false, text: `Not seen: the ground is hidden${where}. Hidden height ${metres(r.hiddenHeightM)}.` };
}

export interface ProfilePanelProps {
  siteId: string;
  hasTerrain: boolean;
  post: Post | null;
  /** The tapped point (WGS 84) and its label (P1, P2, …); null before the first tap. */
  target: { latDeg: number; lonDeg: number; label: string } | null;
  conditions: readonly RefractionPresetId[];
  onConditions: (ids: RefractionPresetId[]) => void;
  targetHeightM: number;
  onTargetHeight: (m: number) => void;
}

/** Profile on tap: conditions and target height by chips, the verdict in words per condition, the side view and the cautions. */
export function ProfilePanel({
  siteId,
  hasTerrain,
  post,
  target,
  conditions,
  onConditions,
  targetHeightM,
  onTargetHeight,
}: ProfilePanelProps) {
  const { height, distance } = useLengthUnits(useSite(siteId).data?.defaultUnits);
  const units = { height, distance };
  const km = (m: number) => (distance === 'km' ? kmText(m) : formatLength(m, distance));
  const metres = (m: number) => lengthIn(m, height, metresText);
  const request: TerrainProfileRequest | null =
    hasTerrain && post && target && conditions.length > 0
      ? {
          postId: post.id,
          target: { latDeg: target.latDeg, lonDeg: target.lonDeg },
          targetHeightM,
          conditions: conditions.map((preset) => ({ preset })),
        }
      : null;
  const profile = useTerrainProfileFor(siteId, request);
  const toggle = (id: RefractionPresetId) => {
    const next = conditions.includes(id) ? conditions.filter((c) => c !== id) : [...conditions, id];
    // Keep chip order, and at least one condition.
    if (next.length > 0) onConditions(PROFILE_CONDITIONS.map((c) => c.id).filter((c) => next.includes(c)));
  };
  const labels = conditions.map((id) => PROFILE_CONDITIONS.find((c) => c.id === id)?.short ?? refractionPreset(id).label);

  const chips = (
    <View style={{ gap: space.md }}>
      <ChipRow label="Refraction conditions">
        {PROFILE_CONDITIONS.map((c) => (
          <Chip key={c.id} label={c.short} on={conditions.includes(c.id)} onPress={() => toggle(c.id)} />
        ))}
      </ChipRow>
      <ChipRow label="Target height above the ground">
        {PROFILE_TARGET_HEIGHTS.map((h) => (
          <Chip
            key={h.m}
            label={restateLengths(h.label, height)}
            on={targetHeightM === h.m}
            onPress={() => onTargetHeight(h.m)}
          />
        ))}
      </ChipRow>
    </View>
  );

  let answer: React.ReactNode;
  if (!hasTerrain) {
    answer = (
      <Notice tone="info" title="No terrain for this site">
        <AppText variant="small">A profile needs the site’s elevation grid. A planner can upload one on the site page.</AppText>
      </Notice>
    );
  } else if (!post) {
    answer = <AppText tone="muted">Choose a post, then tap a point on the map.</AppText>;
  } else if (!target) {
    answer = <AppText tone="muted">Tap a point on the map to see what {post.name} sees of it.</AppText>;
  } else if (profile.isPending) {
    answer = <LoadingState label="Working out the profile…" />;
  } else if (profile.isError) {
    answer = <ErrorState error={profile.error} onRetry={() => void profile.refetch()} />;
  } else {
    const data = profile.data;
    answer = (
      <View style={{ gap: space.md }}>
        <View style={{ gap: 2 }}>
          <AppText variant="heading">
            From {post.name} to {target.label}
          </AppText>
          <AppText variant="small" tone="muted">
            {km(data.distanceM)} at {Math.round(data.gridBearingDeg)}° (grid) · eye {metres(data.observer.eyeElevationM)} · point
            ground {metres(data.target.groundElevationM)}
          </AppText>
        </View>
        <View style={{ gap: space.xs }} role="list" aria-label="Verdict per condition">
          {data.results.map((r, i) => {
            const v = verdictText(r, targetHeightM, units);
            return (
              <View
                key={conditions[i] ?? i}
                role="listitem"
                style={[
                  styles.verdict,
                  { borderLeftColor: conditionStyle(i).color, backgroundColor: v.seen ? colors.mossSoft : colors.cautionSoft },
                ]}
              >
                <AppText variant="label">
                  {labels[i]} (k = {r.k.toFixed(2)})
                </AppText>
                <AppText variant="small">{v.text}</AppText>
              </View>
            );
          })}
        </View>
        <ProfileView profile={data} labels={labels} units={{ height, distance }} />
      </View>
    );
  }

  const answered = !!request && profile.isSuccess;
  return (
    <View style={{ gap: space.lg }} aria-label="Terrain profile">
      {answer}
      {hasTerrain ? chips : null}
      <CautionsPanel cautions={answered ? profile.data.cautions : STANDING_CAUTIONS} />
    </View>
  );
}

const styles = StyleSheet.create({
  verdict: { borderLeftWidth: 4, paddingLeft: space.sm, paddingVertical: 2, borderRadius: radius.sm },
});
