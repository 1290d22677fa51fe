import { useLocalSearchParams } from 'expo-router';
import { isAuditEntityType } from '@/shared/schemas/audit-entity-types';
import { readIdParams } from '@/components/data/route-params';
import { deferredScreen } from '@/components/shell/deferred-screen';
import { BadAddress } from '@/components/ui/bad-address';

const HistoryScreen = deferredScreen('HistoryScreen');

export default function HistoryRoute() {
  const params = useLocalSearchParams();
  const ids = readIdParams(params, [], ['entityId']);
  const { entityType } = params;
  if (!ids || (entityType !== undefined && !isAuditEntityType(entityType))) {
    return <BadAddress title="History" what="a record" />;
  }
  return <HistoryScreen entityType={entityType} entityId={ids.entityId} />;
}
