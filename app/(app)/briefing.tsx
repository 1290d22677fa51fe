import { BriefingScreen } from '@/components/briefing/briefing-screen';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

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
