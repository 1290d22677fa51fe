import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const BriefingScreen = deferredScreen('BriefingScreen');

function BriefingRouteContent() {
  return <BriefingScreen />;
}

/** The tab's title until the page below names itself more precisely. */
export default function BriefingRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Briefing')} />
      <BriefingRouteContent />
    </>
  );
}
