import { HomeOverview } from '@/components/home/home-overview';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

function HomeScreenContent() {
  return <HomeOverview />;
}

/** The tab's title until the page below names itself more precisely. */
export default function HomeScreen() {
  return (
    <>
      <PageTitle title={documentTitle('Home')} />
      <HomeScreenContent />
    </>
  );
}
