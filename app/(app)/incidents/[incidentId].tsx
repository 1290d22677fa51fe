import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const IncidentScreen = deferredScreen('IncidentScreen');
const Params = z.object({ incidentId: z.uuid() });

function IncidentRouteContent() {
  const parsed = Params.safeParse(useLocalSearchParams());
  return parsed.success ? (
    <IncidentScreen incidentId={parsed.data.incidentId} />
  ) : (
    <BadAddress title="Incident" what="an incident" />
  );
}

/** The tab's title until the page below names itself more precisely. */
export default function IncidentRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Incident')} />
      <IncidentRouteContent />
    </>
  );
}
