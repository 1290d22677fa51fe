import { Linking, View } from 'react-native';
import type { ChainCheck, IncidentEntry } from '@/shared/schemas/incident';
import { incidentExportUrls } from '@/components/data/incidents';
import { when } from '@/components/plans/when';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/states';
import { colors, space } from '@/components/ui/theme';
import { entrySummary } from './incident-words';

/** Whether the log's hash chain is whole, said plainly. */
export function ChainNotice({ chain }: { chain: ChainCheck }) {
  return chain.intact ? (
    <Notice tone="info" title="Log intact">
      <AppText variant="small">
        All {chain.entries} entries check out: each carries the hash of the one before, so a changed or removed entry would show
        here.
      </AppText>
    </Notice>
  ) : (
    <Notice tone="danger" title={`Log broken at entry ${chain.firstBrokenSeq ?? '?'}`}>
      <AppText variant="small">{chain.message} Do not rely on entries from there on; tell your administrator.</AppText>
    </Notice>
  );
}

/** The append-only log, newest first, with its exports. */
export function IncidentLog({
  incidentId,
  entries,
  chain,
}: {
  incidentId: string;
  entries: readonly IncidentEntry[];
  chain: ChainCheck;
}) {
  const broken = chain.firstBrokenSeq;
  return (
    <Card style={{ gap: space.md }} aria-label="Incident log">
      <AppText variant="heading">Log</AppText>
      <ChainNotice chain={chain} />
      <View style={{ gap: space.sm }} role="list">
        {[...entries].reverse().map((e) => {
          const { title, detail } = entrySummary(e);
          const suspect = broken !== null && e.seq >= broken;
          return (
            <View
              key={e.seq}
              role="listitem"
              style={{
                gap: 2,
                borderLeftWidth: 3,
                paddingLeft: space.sm,
                borderLeftColor: suspect ? colors.danger : colors.line,
              }}
            >
              <AppText variant="label">
                {e.seq}. {title}
              </AppText>
              {detail ? <AppText variant="small">{detail}</AppText> : null}
              <AppText variant="small" tone="muted">
                {when(e.recordedAt)} · {e.actor.name} · #{e.hash.slice(0, 10)}
              </AppText>
            </View>
          );
        })}
      </View>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
        <Button
          kind="secondary"
          label="Log (CSV)"
          aria-label="Download the log as CSV"
          onPress={() => void Linking.openURL(incidentExportUrls.logCsv(incidentId))}
        />
        <Button
          kind="secondary"
          label="Map features (GeoJSON)"
          aria-label="Download the posts, bearings and fix as GeoJSON"
          onPress={() => void Linking.openURL(incidentExportUrls.geoJson(incidentId))}
        />
      </View>
    </Card>
  );
}
