import { LibraryScreen } from '@/components/library/library-screen';

export default function LibraryRoute() {
  return <LibraryScreen />;
}
