// Over 300 lines: the site terrain card: upload with progress, extent sketch and boundary-from-terrain action.
import { useState } from 'react';
import { Image, StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import Svg, { Polygon } from 'react-native-svg';
import type { Site } from '@/shared/schemas/site';
import { TERRAIN_FORMAT_LABELS, type SiteTerrain } from '@/shared/schemas/terrain';
import { gridProjection } from '@/shared/terrain/grid-projection';
import { ApiRequestError } from '@/components/data/api-client';
import type { PickedFile } from '@/components/data/file-part';
import { distanceIn, formatLength } from '@/components/check/format';
import { useLengthUnits } from '@/components/data/session';
import { useBoundaryFromTerrain } from '@/components/data/placement';
import { useSiteTerrain, useUploadTerrain } from '@/components/data/terrain';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { AppText } from '@/components/ui/app-text';
import { FilePickerField } from '@/components/ui/file-picker-field';
import { ProgressBar } from '@/components/ui/progress-bar';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState, ErrorState, FormError, LoadingState, Notice } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { colors, radius, space } from '@/components/ui/theme';

const km = (metres: number) => `${(metres / 1000).toFixed(metres < 10_000 ? 2 : 1)} km`;

/** The site's terrain: hillshade with the boundary, grid facts, and for planners an upload control. */
export function TerrainPanel({ site, canUpload }: { site: Site; canUpload: boolean }) {
  const terrain = useSiteTerrain(site.id);
  return (
    <Card aria-label="Terrain" style={{ gap: space.md }}>
      <AppText variant="heading">Terrain</AppText>
      {terrain.isPending ? (
        <LoadingState label="Loading the terrain…" />
      ) : terrain.isError ? (
        <ErrorState error={terrain.error} onRetry={() => void terrain.refetch()} />
      ) : terrain.data === null ? (
        <EmptyState
          title="No terrain yet"
          body={`An elevation grid of the site lets Kenning look up ground heights, draw terrain profiles and work out what each post sees.${canUpload ? ` Upload one below${site.boundary ? '' : '; its extent can then become the site’s boundary'}.` : ' A planner can upload one.'}`}
        />
      ) : (
        <>
          <TerrainFacts site={site} terrain={terrain.data} />
          {canUpload ? <BoundaryFromTerrain site={site} /> : null}
        </>
      )}
      {canUpload && !terrain.isPending && !terrain.isError ? (
        <TerrainUploadForm siteId={site.id} replacing={terrain.data !== null} />
      ) : null}
    </Card>
  );
}

function TerrainFacts({ site, terrain }: { site: Site; terrain: SiteTerrain }) {
  const { height, distance } = useLengthUnits(site.defaultUnits);
  const extent = (m: number) => distanceIn(m, distance, km);
  const layer = terrain.baseLayer;
  const widthM = terrain.width * terrain.cellSizeM;
  const heightM = terrain.height * terrain.cellSizeM;
  return (
    <View style={{ gap: space.sm }}>
      <TerrainPicture site={site} terrain={terrain} />
      <AppText variant="small" tone="muted">
        Hillshade, north up, lit from the north-west.{' '}
        {layer.widthPx < terrain.width ? `Shown at ${layer.widthPx} × ${layer.heightPx} px. ` : ''}
        {site.boundary ? 'Outline: the site boundary.' : ''}
      </AppText>
      <View style={styles.facts}>
        <Fact label="Grid" value={`${terrain.width} × ${terrain.height} cells · ${extent(widthM)} × ${extent(heightM)}`} />
        <Fact label="Cell size" value={`${terrain.cellSizeM} m`} />
        <Fact label="Coordinate system" value={terrain.crs.label} />
        <Fact
          label="Ground"
          value={
            height === 'm'
              ? `${Math.round(terrain.minElevationM)} – ${Math.round(terrain.maxElevationM)} m`
              : `${formatLength(terrain.minElevationM, height)} – ${formatLength(terrain.maxElevationM, height)}`
          }
        />
        {terrain.nodataCells > 0 ? <Fact label="Cells without data" value={terrain.nodataCells.toLocaleString('en')} /> : null}
        <Fact label="File" value={`${terrain.originalName} (${TERRAIN_FORMAT_LABELS[terrain.originalFormat]})`} />
        <Fact
          label="Uploaded"
          value={`${new Date(terrain.createdAt).toLocaleDateString('en-GB')} by ${terrain.uploadedBy.name}`}
        />
      </View>
      {terrain.coversBoundary === false ? (
        <Notice tone="caution" title="Part of the site is outside this terrain">
          <AppText variant="small">
            Ground outside the grid, or without data, is not assessed. Upload a terrain that covers the whole boundary.
          </AppText>
        </Notice>
      ) : null}
    </View>
  );
}

/** “Use the terrain’s extent as the boundary”: the grid's rectangle reprojected to WGS 84, after a confirmation. */
function BoundaryFromTerrain({ site }: { site: Site }) {
  const apply = useBoundaryFromTerrain(site.id);
  const [asking, setAsking] = useState(false);
  const [done, setDone] = useState(false);
  const explanation =
    'The boundary becomes the terrain grid’s rectangle — through the centres of its outermost cells, so every point of it has a ground height — reprojected to WGS 84 (its sides are slightly curved in degrees). Cells without data at the grid’s edges fall inside it. You can edit the boundary afterwards.';
  return (
    <View style={styles.form} aria-label="Boundary from the terrain">
      {done ? (
        <Notice tone="info">
          <AppText variant="small">The site’s boundary is now the terrain’s extent.</AppText>
        </Notice>
      ) : null}
      {!site.boundary ? (
        <AppText variant="small">This site has no boundary yet: the terrain’s extent can be its boundary.</AppText>
      ) : null}
      <Button
        kind={site.boundary ? 'secondary' : 'primary'}
        label="Use the terrain’s extent as the boundary"
        onPress={() => {
          apply.reset();
          setAsking(true);
        }}
        style={{ alignSelf: 'flex-start' }}
      />
      <AppText variant="small" tone="muted">
        {explanation}
      </AppText>
      <ConfirmDialog
        visible={asking}
        title={site.boundary ? 'Replace the boundary with the terrain’s extent?' : 'Use the terrain’s extent as the boundary?'}
        consequence={`${site.boundary ? 'The boundary drawn now is replaced. ' : ''}${explanation}`}
        confirmLabel="Use the extent"
        busy={apply.isPending}
        error={apply.error?.message}
        onConfirm={() =>
          apply.mutate(site.version, {
            onSuccess: () => {
              setAsking(false);
              setDone(true);
            },
          })
        }
        onCancel={() => setAsking(false)}
      />
    </View>
  );
}

function Fact({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.fact}>
      <AppText variant="small" tone="muted">
        {label}
      </AppText>
      <AppText variant="small">{value}</AppText>
    </View>
  );
}

/** The hillshade picture, with the site boundary drawn over it in the grid's own coordinates. */
function TerrainPicture({ site, terrain }: { site: Site; terrain: SiteTerrain }) {
  const [width, setWidth] = useState(0);
  const onLayout = (e: LayoutChangeEvent) => setWidth(e.nativeEvent.layout.width);
  const layer = terrain.baseLayer;
  const height = width > 0 ? Math.min((width * layer.heightPx) / layer.widthPx, 520) : 0;
  const drawWidth = height > 0 ? (height * layer.widthPx) / layer.heightPx : 0;
  let outline: string | null = null;
  if (site.boundary && drawWidth > 0) {
    try {
      const grid = gridProjection(terrain.crs);
      const { west, east, south, north } = layer.gridBounds;
      outline = site.boundary
        .map(([lonDeg, latDeg]) => {
          const { x, y } = grid.toGrid({ latDeg, lonDeg });
          return `${(((x - west) / (east - west)) * drawWidth).toFixed(1)},${(((north - y) / (north - south)) * height).toFixed(1)}`;
        })
        .join(' ');
    } catch {
      outline = null; // a CRS the browser cannot convert: the picture alone
    }
  }
  return (
    <View onLayout={onLayout} style={{ width: '100%' }}>
      {width > 0 ? (
        <View style={[styles.picture, { width: drawWidth, height }]} role="img" aria-label={`Hillshade of ${site.name}`}>
          <Image source={{ uri: layer.url }} style={{ width: drawWidth, height }} resizeMode="stretch" />
          {outline ? (
            <Svg width={drawWidth} height={height} style={StyleSheet.absoluteFill} pointerEvents="none">
              <Polygon points={outline} fill="none" stroke={colors.ember} strokeWidth={2.5} />
            </Svg>
          ) : null}
        </View>
      ) : (
        <View style={{ height: 200 }} />
      )}
    </View>
  );
}

/** File name endings the chooser offers (the server reads the content, whatever the name). */
const ACCEPTED = ['.tif', '.tiff', '.asc'];

/** Upload (or replace) the site's terrain, with progress and the server's field errors. */
function TerrainUploadForm({ siteId, replacing }: { siteId: string; replacing: boolean }) {
  const upload = useUploadTerrain(siteId);
  const [file, setFile] = useState<PickedFile | null>(null);
  const [prj, setPrj] = useState<PickedFile | null>(null);
  const [epsg, setEpsg] = useState('');
  const [progress, setProgress] = useState(0);
  const [errors, setErrors] = useState<{ file?: string; prj?: string; epsg?: string }>({});
  const [formError, setFormError] = useState('');
  const [done, setDone] = useState('');
  const isAscii = !!file && /\.asc$/i.test(file.name);

  const submit = () => {
    setFormError('');
    setDone('');
    if (!file) {
      setErrors({ file: 'Choose a GeoTIFF (.tif, .tiff) or an ESRI ASCII grid (.asc).' });
      return;
    }
    setErrors({});
    setProgress(0);
    upload.mutate(
      { file, prj: isAscii ? prj : null, epsg, onProgress: setProgress },
      {
        onSuccess: ({ terrain }) => {
          setFile(null);
          setPrj(null);
          setEpsg('');
          setDone(`${terrain.originalName} is now the site’s terrain.`);
        },
        onError: (e) => {
          if (e instanceof ApiRequestError) {
            setErrors({ file: e.fields.file, prj: e.fields.prj, epsg: e.fields.epsg });
          }
          setFormError(e.message);
        },
      },
    );
  };

  const checking = upload.isPending && progress >= 1;
  return (
    <View aria-label={replacing ? 'Replace terrain' : 'Upload terrain'} style={styles.form}>
      <AppText variant="label">{replacing ? 'Replace the terrain' : 'Upload a terrain'}</AppText>
      <AppText variant="small" tone="muted">
        GeoTIFF, or ESRI ASCII grid with its .prj, in a projected coordinate system in metres (e.g. UTM). Up to 25 million cells
        (5000 × 5000) and 400 MB. The previous terrain is kept for the plans that used it.
      </AppText>
      <FormError message={formError} />
      {done ? (
        <Notice tone="info">
          <AppText variant="small">{done}</AppText>
        </Notice>
      ) : null}
      <FilePickerField
        label="Terrain file"
        buttonLabel="Choose file"
        types={ACCEPTED}
        file={file}
        error={errors.file}
        onPick={(picked) => {
          setFile(picked);
          setErrors((e) => ({ ...e, file: undefined }));
        }}
      />
      {isAscii ? (
        <FilePickerField
          label="Coordinate system (.prj), optional"
          buttonLabel="Choose .prj"
          types={['.prj']}
          file={prj}
          error={errors.prj}
          hint="The .prj file that came with the grid."
          onPick={setPrj}
        />
      ) : null}
      <TextField
        label="EPSG code, if the file has no coordinate system"
        value={epsg}
        onChangeText={setEpsg}
        inputMode="numeric"
        error={errors.epsg}
        hint="E.g. 32633 for WGS 84 / UTM zone 33N. Leave empty when the file carries its own."
      />
      {upload.isPending ? (
        <View aria-live="polite">
          <ProgressBar
            label={checking ? 'Checking the grid and drawing its hillshade…' : 'Sending the terrain'}
            fraction={progress}
          />
        </View>
      ) : null}
      <Button label={replacing ? 'Replace terrain' : 'Upload terrain'} onPress={submit} busy={upload.isPending} />
    </View>
  );
}

const styles = StyleSheet.create({
  picture: { borderRadius: radius.md, overflow: 'hidden', backgroundColor: colors.paper, alignSelf: 'center' },
  facts: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.xl, rowGap: space.sm },
  fact: { flexBasis: '40%', flexGrow: 1, gap: 2 },
  form: { gap: space.md, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.md },
});
