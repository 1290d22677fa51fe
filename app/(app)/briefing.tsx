import { BriefingScreen } from '@/components/briefing/briefing-screen';

export default function BriefingRoute() {
  return <BriefingScreen />;
}
