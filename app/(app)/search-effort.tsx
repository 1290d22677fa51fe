import { deferredScreen } from '@/components/shell/deferred-screen';

const SearchEffortScreen = deferredScreen('SearchEffortScreen');

export default function SearchEffortRoute() {
  return <SearchEffortScreen />;
}
