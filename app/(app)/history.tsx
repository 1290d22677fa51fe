import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { AUDIT_ENTITY_TYPES } from '@/shared/schemas/audit';
import { deferredScreen } from '@/components/shell/deferred-screen';
import { AppText } from '@/components/ui/app-text';
import { Screen } from '@/components/ui/screen';
import { Notice } from '@/components/ui/states';

const HistoryScreen = deferredScreen('HistoryScreen');

const Params = z.object({ entityType: z.enum(AUDIT_ENTITY_TYPES).optional(), entityId: z.uuid().optional() });

export default function HistoryRoute() {
  const parsed = Params.safeParse(useLocalSearchParams());
  if (!parsed.success) {
    return (
      <Screen title="History">
        <Notice tone="danger">
          <AppText>This address does not name a record.</AppText>
        </Notice>
      </Screen>
    );
  }
  return <HistoryScreen entityType={parsed.data.entityType} entityId={parsed.data.entityId} />;
}
