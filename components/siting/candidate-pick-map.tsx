import { useMemo } from 'react';
import { Circle, Polyline } from 'react-native-svg';
import type { Post, Site } from '@/shared/schemas/site';
import { OverlaySvg, overlayPoint } from '@/components/map/overlay-svg';
import { PickingMap } from '@/components/map/picking-map';
import { siteMapFrame } from '@/components/map/site-map-frame';
import { useSiteTerrain } from '@/components/data/terrain';
import { AppText } from '@/components/ui/app-text';
import { colors } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';

/**
 * The site map (hillshade, boundary, zones, posts) for picking a candidate by
 * tapping: each tap hands the point's latitude and longitude to `onPick`;
 * the points picked so far are drawn as rings, and `line` (an access line
 * being drawn), when given, as a dashed line through its points.
 */
export function CandidatePickMap({
  site,
  posts,
  picked,
  line = null,
  onPick,
  label = 'Site map: tap a place to take it as a candidate',
}: {
  site: Site;
  posts: readonly Post[];
  picked: readonly { latDeg: number; lonDeg: number }[];
  line?: readonly { latDeg: number; lonDeg: number }[] | null;
  onPick: (at: { latDeg: number; lonDeg: number }) => void;
  label?: string;
}) {
  const terrain = useSiteTerrain(site.id);
  const { wide } = useLayout();
  const frame = useMemo(
    () => (terrain.isPending ? null : siteMapFrame(site, posts, terrain.data ?? null)),
    [site, posts, terrain.isPending, terrain.data],
  );
  if (!frame) return <AppText tone="muted">Loading the map…</AppText>;
  const points = picked.map((p) => frame.projection.toGrid(p));
  const linePoints = (line ?? []).map((p) => frame.projection.toGrid(p));
  return (
    <PickingMap
      frame={frame}
      height={wide ? 420 : 340}
      units={site.defaultUnits}
      onTap={(point) => onPick(frame.projection.toLatLon(point.x, point.y))}
      label={label}
      overlay={({ camera, size, margin }) => {
        const at = overlayPoint(camera, size, margin);
        return (
          <OverlaySvg size={size} margin={margin}>
            {linePoints.length > 1 ? (
              <Polyline
                points={linePoints
                  .map(at)
                  .map((s) => `${s.x},${s.y}`)
                  .join(' ')}
                fill="none"
                stroke={colors.ink}
                strokeWidth={3}
                strokeDasharray="8 5"
              />
            ) : null}
            {linePoints.map((p, i) => {
              const s = at(p);
              return <Circle key={`line-${i}`} cx={s.x} cy={s.y} r={5} fill={colors.ink} />;
            })}
            {points.map((p, i) => {
              const s = at(p);
              return <Circle key={i} cx={s.x} cy={s.y} r={8} fill="none" stroke={colors.ember} strokeWidth={3} />;
            })}
          </OverlaySvg>
        );
      }}
    />
  );
}
