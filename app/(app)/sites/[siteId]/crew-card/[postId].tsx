import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const CrewCardScreen = deferredScreen('CrewCardScreen');

const Params = z.object({ siteId: z.uuid(), postId: z.uuid() });

function CrewCardRouteContent() {
  const parsed = Params.safeParse(useLocalSearchParams());
  return parsed.success ? <CrewCardScreen {...parsed.data} /> : <BadAddress title="Crew card" what="a post" />;
}

/** The tab's title until the page below names itself more precisely. */
export default function CrewCardRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Crew card')} />
      <CrewCardRouteContent />
    </>
  );
}
