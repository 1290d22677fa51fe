import { QuickCheck } from '@/components/check/quick-check';

export default function QuickCheckScreen() {
  return <QuickCheck />;
}
