import { useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { auditValue, describeAuditEvent, fieldLabel } from '@/shared/audit/describe-audit-event';
import { AUDIT_ENTITY_LABELS, AUDIT_ENTITY_TYPES, type AuditEntityType, type AuditEvent } from '@/shared/schemas/audit';
import { ApiRequestError } from '@/components/data/api-client';
import { useAuditEvents, type AuditFilter } from '@/components/data/audit';
import { usePeople } from '@/components/data/roster';
import { useSession } from '@/components/data/session';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Chip } from '@/components/ui/chip';
import { Pager } from '@/components/ui/pager';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';
import { FieldRow } from '@/components/ui/field-row';

/** A typed day (YYYY-MM-DD) as the ISO time of its start, UTC; '' stays unset, anything else is an error. */
function dayStart(text: string): string | undefined | Error {
  const t = text.trim();
  if (!t) return undefined;
  if (!/^\d{4}-\d{2}-\d{2}$/.test(t) || Number.isNaN(Date.parse(`${t}T00:00:00Z`)))
    return new Error('Write the day as YYYY-MM-DD.');
  return `${t}T00:00:00Z`;
}
const nextDay = (iso: string) => new Date(Date.parse(iso) + 86_400_000).toISOString();

/** A day typed as YYYY-MM-DD, with what `dayStart` made of it: its error under the field. */
function DayField({
  text,
  day,
  example,
  onChange,
  ...props
}: {
  label: string;
  text: string;
  day: string | undefined | Error;
  example: string;
  hint: string;
  onChange: (text: string) => void;
}) {
  const error = day instanceof Error ? day.message : undefined;
  return <TextField {...props} value={text} onChangeText={onChange} placeholder={example} error={error} />;
}

/**
 * The audit trail: every write in the organisation (or one record's, with
 * `entityId`), newest first, each as a sentence with the fields that changed,
 * before → after. Filters: kind of record, person, days (UTC).
 */
export function HistoryScreen({ entityType, entityId }: { entityType?: AuditEntityType; entityId?: string }) {
  const router = useRouter();
  const { data: user } = useSession();
  const allowed = user?.role === 'admin' || user?.role === 'reviewer';
  const [kind, setKind] = useState<AuditEntityType | undefined>(entityType);
  const [actorId, setActorId] = useState<string | undefined>(undefined);
  const [fromText, setFromText] = useState('');
  const [toText, setToText] = useState('');
  const [page, setPage] = useState(1);
  const from = dayStart(fromText);
  const to = dayStart(toText);
  /** A changed day starts the list again from its first page. */
  const typed = (set: (text: string) => void) => (text: string) => (set(text), setPage(1));
  const filter: AuditFilter = {
    entityType: entityId ? entityType : kind,
    entityId,
    actorId,
    from: from instanceof Error ? undefined : from,
    to: to instanceof Error || to === undefined ? undefined : nextDay(to),
    page,
  };
  const events = useAuditEvents(filter);
  const people = usePeople(allowed && !entityId);
  const record = entityId ? events.data?.items[0] : undefined;
  const title = entityId ? 'History of this record' : 'History';
  const subtitle = entityId
    ? record
      ? `${AUDIT_ENTITY_LABELS[record.entityType as AuditEntityType] ?? record.entityType}${record.entityName ? ` “${record.entityName}”` : ''}`
      : undefined
    : 'Every change in your organisation, newest first.';

  const body = () => {
    if (events.isPending) return <LoadingState label="Loading the history…" />;
    if (events.isError) {
      if (events.error instanceof ApiRequestError && events.error.status === 404) {
        return <EmptyState title="No recorded changes" body="Kenning has no changes on record for this in your organisation." />;
      }
      return <ErrorState error={events.error} onRetry={() => void events.refetch()} />;
    }
    if (events.data.items.length === 0) {
      return <EmptyState title="Nothing matches" body="No changes match these filters. Clear a filter or widen the days." />;
    }
    return (
      <View style={{ gap: space.sm }}>
        <AppText tone="muted">
          {events.data.total} change{events.data.total === 1 ? '' : 's'}
        </AppText>
        {events.data.items.map((e) => (
          <EventCard key={e.id} event={e} />
        ))}
        <Pager page={events.data.page} pageSize={events.data.pageSize} total={events.data.total} onPage={setPage} />
      </View>
    );
  };

  return (
    <Screen
      title={title}
      subtitle={subtitle}
      maxWidth={900}
      actions={
        entityId ? (
          <Button kind="quiet" role="link" label="Whole organisation" onPress={() => router.navigate('/history')} />
        ) : undefined
      }
    >
      {!allowed && user ? (
        <Notice tone="info">
          <AppText>Administrators and reviewers read the history of changes.</AppText>
        </Notice>
      ) : null}
      {!entityId ? (
        <Card aria-label="Filters" style={{ gap: space.sm }}>
          <AppText variant="label">Kind of record</AppText>
          <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.xs }}>
            <Chip label="All" on={!kind} onPress={() => (setKind(undefined), setPage(1))} />
            {AUDIT_ENTITY_TYPES.map((t) => (
              <Chip
                key={t}
                label={AUDIT_ENTITY_LABELS[t]}
                on={kind === t}
                onPress={() => (setKind(kind === t ? undefined : t), setPage(1))}
              />
            ))}
          </View>
          {people.data && people.data.length > 0 ? (
            <>
              <AppText variant="label">Person</AppText>
              <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.xs }}>
                {people.data.map((p) => (
                  <Chip
                    key={p.id}
                    label={p.name}
                    on={actorId === p.id}
                    onPress={() => (setActorId(actorId === p.id ? undefined : p.id), setPage(1))}
                  />
                ))}
              </View>
            </>
          ) : null}
          <FieldRow minWidth={150} gap={space.md}>
            <DayField label="From day" text={fromText} day={from} example="2026-06-01" hint="UTC" onChange={typed(setFromText)} />
            <DayField
              label="To day"
              text={toText}
              day={to}
              example="2026-06-30"
              hint="UTC, included"
              onChange={typed(setToText)}
            />
          </FieldRow>
        </Card>
      ) : null}
      {allowed || !user ? body() : null}
    </Screen>
  );
}

function EventCard({ event }: { event: AuditEvent }) {
  const showChanges = event.action === 'update' && event.changes.length > 0;
  return (
    <Card aria-label={describeAuditEvent(event)} style={{ gap: space.xs }}>
      <AppText>{describeAuditEvent(event)}</AppText>
      <AppText variant="small" tone="muted">
        {new Date(event.at).toLocaleString()}
      </AppText>
      {showChanges ? (
        <View style={{ gap: 2 }}>
          {event.changes.map((c) => (
            <AppText key={c.field} variant="small">
              {fieldLabel(c.field)}: {auditValue(c.before)} → {auditValue(c.after)}
            </AppText>
          ))}
        </View>
      ) : null}
    </Card>
  );
}
