import { useState } from 'react';
import { View } from 'react-native';
import { GeoJsonImportError, polygonsFromGeoJson, type ImportedPolygon } from '@/shared/geo/polygons-from-geojson';
import type { PickedFile } from '@/components/data/file-part';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { FilePickerField } from '@/components/ui/file-picker-field';
import { space } from '@/components/ui/theme';
import { cornerCount } from './ring-field';

/** The file types the picker offers: GeoJSON by extension and by MIME type. */
const GEOJSON_TYPES = ['.geojson', '.json', 'application/geo+json', 'application/json'] as const;

/** A picked file's text (the browser's File, else the file's local URI). */
async function textOf(file: PickedFile): Promise<string> {
  if (file.file) return file.file.text();
  return (await fetch(file.uri)).text();
}

/**
 * Importing outlines from a GeoJSON file (Polygon or MultiPolygon; WGS 84
 * degrees). Lists what the file holds; `onUse` takes one polygon, `onUseAll`
 * (when given) all of them. Other geometry types, degrees out of range and
 * self-crossing rings are refused with the problem named.
 */
export function GeoJsonImport({
  label,
  onUse,
  onUseAll,
  useLabel = 'Use this outline',
}: {
  label: string;
  onUse?: (polygon: ImportedPolygon) => void;
  onUseAll?: (polygons: ImportedPolygon[]) => void;
  useLabel?: string;
}) {
  const [file, setFile] = useState<PickedFile | null>(null);
  const [error, setError] = useState('');
  const [found, setFound] = useState<ImportedPolygon[] | null>(null);
  const pick = async (picked: PickedFile) => {
    setFile(picked);
    setFound(null);
    setError('');
    try {
      setFound(polygonsFromGeoJson(await textOf(picked)));
    } catch (e) {
      setError(
        e instanceof GeoJsonImportError
          ? e.message
          : `The file cannot be read: ${e instanceof Error ? e.message : 'unknown error'}.`,
      );
    }
  };
  return (
    <View style={{ gap: space.sm }}>
      <FilePickerField
        label={label}
        buttonLabel="Choose a GeoJSON file"
        types={GEOJSON_TYPES}
        file={file}
        error={error || undefined}
        hint="Polygon or MultiPolygon, longitude and latitude in WGS 84 degrees (RFC 7946)."
        onPick={(f) => void pick(f)}
      />
      {found ? (
        <View style={{ gap: space.sm }} aria-label="Outlines in the file">
          <AppText>
            The file holds {found.length === 1 ? 'one outline' : `${found.length} outlines`}.
            {found.some((p) => p.holes > 0)
              ? ' Holes are left out: an outline here is one ring (mark the inner parts as zones if they matter).'
              : ''}
          </AppText>
          {found.map((p, i) => (
            <View key={i} style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' }}>
              <AppText style={{ flex: 1, minWidth: 160 }}>
                {p.name}: {cornerCount(p.ring)} corners
                {p.holes > 0 ? `, ${p.holes} hole${p.holes === 1 ? '' : 's'} left out` : ''}
              </AppText>
              {onUse ? (
                <Button
                  kind="secondary"
                  label={found.length === 1 ? useLabel : `${useLabel}: ${p.name}`}
                  onPress={() => onUse(p)}
                />
              ) : null}
            </View>
          ))}
          {onUseAll ? (
            <Button
              kind="secondary"
              label={found.length === 1 ? 'Add it as a zone' : `Add all ${found.length} as zones`}
              onPress={() => onUseAll(found)}
              style={{ alignSelf: 'flex-start' }}
            />
          ) : null}
        </View>
      ) : null}
    </View>
  );
}
