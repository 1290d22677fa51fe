import { useLocalSearchParams } from 'expo-router';
import { deferredScreen } from '@/components/shell/deferred-screen';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

const VerifyPrintoutScreen = deferredScreen('VerifyPrintoutScreen');

/** `/verify[?hash=…]`: check a printout's content hash (a hash in the address is looked up at once). */
export default function VerifyRoute() {
  const { hash } = useLocalSearchParams<{ hash?: string }>();
  return (
    <>
      <PageTitle title={documentTitle('Verify a printout')} />
      <VerifyPrintoutScreen initialHash={typeof hash === 'string' ? hash : undefined} />
    </>
  );
}
