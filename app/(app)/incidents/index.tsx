import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const IncidentsScreen = deferredScreen('IncidentsScreen');

/** The tab's title until the page below names itself more precisely. */
export default function IncidentsRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Incidents')} />
      <IncidentsScreen />
    </>
  );
}
