import { useIdParams } from '@/components/data/route-params';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const IncidentScreen = deferredScreen('IncidentScreen');

function IncidentRouteContent() {
  const ids = useIdParams(['incidentId']);
  return ids ? <IncidentScreen incidentId={ids.incidentId} /> : <BadAddress title="Incident" what="an incident" />;
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
