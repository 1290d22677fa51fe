import { useLocalSearchParams } from 'expo-router';
import { deferredScreen } from '@/components/shell/deferred-screen';

const VerifyPrintoutScreen = deferredScreen('VerifyPrintoutScreen');

/** `/verify[?hash=…]`: check a printout's content hash (a hash in the address is looked up at once). */
export default function VerifyRoute() {
  const { hash } = useLocalSearchParams<{ hash?: string }>();
  return <VerifyPrintoutScreen initialHash={typeof hash === 'string' ? hash : undefined} />;
}
