import { useRouter } from 'expo-router';
import { useState } from 'react';
import { Linking, View } from 'react-native';
import type { CoverageLayerName, CoverageSnapshot } from '@/shared/schemas/coverage';
import { LAYER_LEGENDS } from '@/shared/terrain/class-layer-legends';
import { exportUrls } from '@/components/data/exports';
import { usePlanRevision } from '@/components/data/plans';
import { CoverageCasePicker } from '@/components/plans/coverage-case-picker';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Chip, ChipRow } from '@/components/ui/chip';
import { space } from '@/components/ui/theme';

/** The standing cautions, short, where figures leave Kenning. */
export const EXPORT_CAUTION =
  'Estimates for planning only: refraction near the horizon varies widely, and visibility is not detection. ' +
  'Follow your agency’s procedures, local regulations and licensed practice.';

const open = (url: string) => void Linking.openURL(url);

/**
 * "Exports" on a plan's page: the frozen revision's results as CSV, its map
 * features as GeoJSON, and each coverage layer as a GeoTIFF or an ESRI
 * ASCII grid (chosen by case and layer). A plan that is still a draft has
 * nothing frozen to export yet.
 */
export function PlanExports({ planId, revision }: { planId: string; revision: number | null }) {
  const router = useRouter();
  const frozen = usePlanRevision(planId, revision);
  return (
    <Card style={{ gap: space.sm }} aria-label="Exports">
      <AppText variant="heading">Exports</AppText>
      {revision === null ? (
        <AppText tone="muted">Files come from a frozen revision: submit the plan to export its results and layers.</AppText>
      ) : (
        <>
          <AppText variant="small" tone="muted">
            Revision {revision} for spreadsheets and GIS. Each file’s name gives the site, plan, version, revision and date.
          </AppText>
          <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
            <Button
              label="Results (CSV)"
              kind="secondary"
              onPress={() => open(exportUrls.resultsCsv(planId, revision))}
              aria-label="Download the results as CSV"
            />
            <Button
              label="Map features (GeoJSON)"
              kind="secondary"
              onPress={() => open(exportUrls.featuresGeoJson(planId, revision))}
              aria-label="Download the map features as GeoJSON"
            />
          </View>
          {frozen.data?.snapshot.coverage ? <LayerExports coverage={frozen.data.snapshot.coverage} /> : null}
          <AppText variant="small" tone="muted">
            {EXPORT_CAUTION}
          </AppText>
        </>
      )}
      <View style={{ flexDirection: 'row' }}>
        <Button label="Verify a printout" kind="quiet" role="link" onPress={() => router.navigate('/verify')} />
      </View>
    </Card>
  );
}

const LAYERS: { id: CoverageLayerName; label: string }[] = [
  { id: 'posts-per-cell', label: 'Posts per cell' },
  { id: 'cross-bearing', label: 'Cross-bearings' },
];

/** One coverage layer of the frozen run, chosen by case and layer (or one post's view), as GeoTIFF or ASCII grid. */
function LayerExports({ coverage }: { coverage: CoverageSnapshot }) {
  const [caseKey, setCaseKey] = useState(coverage.cases[0]?.key ?? null);
  const [layer, setLayer] = useState<{ id: CoverageLayerName; postId?: string }>({ id: 'posts-per-cell' });
  const shown = coverage.cases.find((c) => c.key === caseKey) ?? coverage.cases[0];
  if (!shown) return null;
  const url = (format: 'tif' | 'asc') => exportUrls.layer(coverage.runId, layer.id, format, shown.key, layer.postId);
  return (
    <View style={{ gap: space.sm }}>
      <AppText variant="label">Coverage layers</AppText>
      <CoverageCasePicker cases={coverage.cases} value={shown.key} onChange={setCaseKey} />
      <ChipRow label="Layer">
        {LAYERS.map((l) => (
          <Chip key={l.id} label={l.label} on={layer.id === l.id} onPress={() => setLayer({ id: l.id })} />
        ))}
        {shown.posts.map((p) => (
          <Chip
            key={p.postId}
            label={`${p.postName} alone`}
            on={layer.id === 'post-visibility' && layer.postId === p.postId}
            onPress={() => setLayer({ id: 'post-visibility', postId: p.postId })}
          />
        ))}
      </ChipRow>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
        <Button label="GeoTIFF" kind="secondary" onPress={() => open(url('tif'))} aria-label="Download the layer as GeoTIFF" />
        <Button
          label="ASCII grid"
          kind="secondary"
          onPress={() => open(url('asc'))}
          aria-label="Download the layer as an ASCII grid"
        />
      </View>
      <AppText variant="small" tone="muted">
        On the terrain’s grid and coordinate system ({coverage.grid.epsg ? `EPSG:${coverage.grid.epsg}` : 'its own CRS'},{' '}
        {coverage.grid.cellSizeM} m cells). Cell values: {LAYER_LEGENDS[layer.id].legend}.
      </AppText>
    </View>
  );
}
