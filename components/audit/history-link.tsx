import { useRouter } from 'expo-router';
import type { AuditEntityType } from '@/shared/schemas/audit';
import { useSession } from '@/components/data/session';
import { Button } from '@/components/ui/button';

/** "History of this record" for administrators and reviewers (who may read the audit trail). */
export function HistoryLink({ entityType, entityId }: { entityType: AuditEntityType; entityId: string }) {
  const { data: user } = useSession();
  const router = useRouter();
  if (user?.role !== 'admin' && user?.role !== 'reviewer') return null;
  return (
    <Button
      kind="quiet"
      role="link"
      label="History of this record"
      onPress={() => router.navigate({ pathname: '/history', params: { entityType, entityId } })}
    />
  );
}
