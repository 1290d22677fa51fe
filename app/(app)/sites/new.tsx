import { deferredScreen } from '@/components/shell/deferred-screen';

const NewSiteScreen = deferredScreen('NewSiteScreen');

export default function NewSiteRoute() {
  return <NewSiteScreen />;
}
