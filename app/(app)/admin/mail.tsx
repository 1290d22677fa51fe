import { CaughtMailList } from '@/components/admin/caught-mail-list';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

function MailScreenContent() {
  return <CaughtMailList />;
}

/** The tab's title until the page below names itself more precisely. */
export default function MailScreen() {
  return (
    <>
      <PageTitle title={documentTitle('Caught mail')} />
      <MailScreenContent />
    </>
  );
}
