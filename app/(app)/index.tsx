import { HomeOverview } from '@/components/home/home-overview';

export default function HomeScreen() {
  return <HomeOverview />;
}
