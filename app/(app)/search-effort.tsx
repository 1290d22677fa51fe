import { SearchEffortScreen } from '@/components/search-effort/search-effort-screen';

export default function SearchEffortRoute() {
  return <SearchEffortScreen />;
}
