import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { AUDIT_ENTITY_TYPES } from '@/shared/schemas/audit';
import { deferredScreen } from '@/components/shell/deferred-screen';
import { BadAddress } from '@/components/ui/bad-address';

const HistoryScreen = deferredScreen('HistoryScreen');

const Params = z.object({ entityType: z.enum(AUDIT_ENTITY_TYPES).optional(), entityId: z.uuid().optional() });

export default function HistoryRoute() {
  const parsed = Params.safeParse(useLocalSearchParams());
  if (!parsed.success) {
    return <BadAddress title="History" what="a record" />;
  }
  return <HistoryScreen entityType={parsed.data.entityType} entityId={parsed.data.entityId} />;
}
