import { Redirect } from 'expo-router';
import { useEffect, useState } from 'react';
import { HomeOverview } from '@/components/home/home-overview';
import { useSession } from '@/components/data/session';
import { isFirstLanding, markLanded } from '@/components/data/first-landing';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

function HomeScreenContent() {
  return <HomeOverview />;
}

/** The tab's title until the page below names itself more precisely; observers land on their watch first. */
export default function HomeScreen() {
  const { data: user } = useSession();
  // Decided once per mount (the same answer on a double render); marked after it.
  const [toBriefing] = useState(() => user?.role === 'observer' && isFirstLanding());
  useEffect(() => {
    if (user) markLanded();
  }, [user]);
  if (toBriefing) return <Redirect href="/briefing" />;
  return (
    <>
      <PageTitle title={documentTitle('Home')} />
      <HomeScreenContent />
    </>
  );
}
