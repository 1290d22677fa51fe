import { useRouter } from 'expo-router';
import { View } from 'react-native';
import { crewCardPdfUrl } from '@/components/data/reports';
import { useCoordinateFormat } from '@/components/map/coordinate-format';
import { Button } from '@/components/ui/button';
import { space } from '@/components/ui/theme';
import { DownloadLink } from './download-link';

/** "Crew card" (the printable screen) and its A5 PDF, for a post's page and the observer's briefing. */
export function CrewCardLinks({ siteId, postId }: { siteId: string; postId: string }) {
  const router = useRouter();
  const [coords] = useCoordinateFormat();
  return (
    <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }} role="group" aria-label="Crew card">
      <Button
        kind="secondary"
        role="link"
        label="Crew card"
        onPress={() => router.navigate({ pathname: '/sites/[siteId]/crew-card/[postId]', params: { siteId, postId } })}
      />
      <DownloadLink href={crewCardPdfUrl(siteId, postId, coords)} label="Crew card (PDF)" />
    </View>
  );
}
