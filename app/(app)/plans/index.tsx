import { PlansScreen } from '@/components/plans/plans-screen';

export default function PlansRoute() {
  return <PlansScreen />;
}
