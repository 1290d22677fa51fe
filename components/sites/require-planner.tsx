import { useSession } from '@/components/data/session';
import { AppText } from '@/components/ui/app-text';
import { Notice } from '@/components/ui/states';

/** Shows its children to planners; others read why they cannot do this here. */
export function RequirePlanner({ what, children }: { what: string; children: React.ReactNode }) {
  const { data: user } = useSession();
  if (user?.role === 'planner') return <>{children}</>;
  return (
    <Notice tone="info">
      <AppText>Only planners {what}. Ask a planner of your organisation, or an administrator to change your role.</AppText>
    </Notice>
  );
}
