import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Pressable, View } from 'react-native';
import { IncidentCreateSchema, type Incident, type IncidentCreate, type IncidentStatus } from '@/shared/schemas/incident';
import { useIncidents, useOpenIncident } from '@/components/data/incidents';
import { applyServerErrors } from '@/components/data/server-errors';
import { useSession } from '@/components/data/session';
import { useSites } from '@/components/data/sites';
import { when } from '@/components/plans/when';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Chip, ChipRow } from '@/components/ui/chip';
import { FormChipChoice } from '@/components/ui/form-chip-choice';
import { FormTextField } from '@/components/ui/form-text-field';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, FormError, LoadingState } from '@/components/ui/states';
import { colors, space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { areaText, STATUS_LABELS } from './incident-words';

const STATUS_FILTERS: { value: IncidentStatus | undefined; label: string }[] = [
  { value: 'open', label: 'Open' },
  { value: 'closed', label: 'Closed' },
  { value: undefined, label: 'All' },
];

/**
 * The organisation's incidents: smokes, lights, vessels being fixed by
 * bearings from the posts. Filter by site and status; planners (and
 * observers on watch) open a new one.
 */
export function IncidentsScreen() {
  const { wide } = useLayout();
  const { data: user } = useSession();
  const sites = useSites();
  const [siteId, setSiteId] = useState<string | undefined>(undefined);
  const [status, setStatus] = useState<IncidentStatus | undefined>('open');
  const incidents = useIncidents({ siteId, status });
  const [opening, setOpening] = useState(false);
  const mayOpen = user?.role === 'planner' || user?.role === 'observer';

  return (
    <Screen
      title="Incidents"
      subtitle="Smokes, lights and vessels fixed by bearings from your posts, with a log nobody can quietly change."
      actions={mayOpen && !opening ? <Button label="Open an incident" onPress={() => setOpening(true)} /> : null}
    >
      {opening ? <OpenIncidentForm siteChoices={sites.data?.items ?? []} onCancel={() => setOpening(false)} /> : null}
      <View style={{ flexDirection: wide ? 'row' : 'column', gap: space.xl, alignItems: 'flex-start' }}>
        <View style={{ width: wide ? 300 : '100%', gap: space.md }} role="group" aria-label="Filter incidents">
          <ChipRow label="Status">
            {STATUS_FILTERS.map((f) => (
              <Chip key={f.label} label={f.label} on={status === f.value} onPress={() => setStatus(f.value)} />
            ))}
          </ChipRow>
          {sites.data && sites.data.items.length > 1 ? (
            <ChipRow label="Site">
              <Chip label="Every site" on={siteId === undefined} onPress={() => setSiteId(undefined)} />
              {sites.data.items.map((s) => (
                <Chip key={s.id} label={s.name} on={siteId === s.id} onPress={() => setSiteId(s.id)} />
              ))}
            </ChipRow>
          ) : null}
        </View>
        <View style={{ flex: wide ? 1 : undefined, width: wide ? undefined : '100%', gap: space.sm }}>
          {incidents.isPending ? (
            <LoadingState label="Loading incidents…" />
          ) : incidents.isError ? (
            <ErrorState error={incidents.error} onRetry={() => void incidents.refetch()} />
          ) : incidents.data.items.length === 0 ? (
            <EmptyState
              title={status === 'open' ? 'No open incidents' : 'No incidents here'}
              body={
                mayOpen
                  ? 'When a lookout sees a smoke, open an incident on its site; bearings from two or more posts give a fix.'
                  : 'Planners and lookouts on watch open incidents; they appear here once they exist.'
              }
            />
          ) : (
            incidents.data.items.map((i) => <IncidentCard key={i.id} incident={i} />)
          )}
        </View>
      </View>
    </Screen>
  );
}

function IncidentCard({ incident }: { incident: Incident }) {
  const router = useRouter();
  const fix = incident.fix;
  return (
    <Pressable
      role="link"
      aria-label={`${incident.title}, ${incident.siteName}`}
      onPress={() => router.navigate({ pathname: '/incidents/[incidentId]', params: { incidentId: incident.id } })}
    >
      <Card style={{ gap: 2 }} accent={incident.status === 'open' ? 'ember' : 'none'}>
        <View style={{ flexDirection: 'row', justifyContent: 'space-between', gap: space.sm, flexWrap: 'wrap' }}>
          <AppText variant="label" style={{ flexShrink: 1 }}>
            {incident.title}
          </AppText>
          <AppText variant="label" style={{ color: incident.status === 'open' ? colors.ember : colors.muted }}>
            {STATUS_LABELS[incident.status]}
          </AppText>
        </View>
        <AppText variant="small" tone="muted">
          {incident.siteName} · opened {when(incident.openedAt)} by {incident.openedBy.name} · {incident.reportCount}{' '}
          {incident.reportCount === 1 ? 'bearing' : 'bearings'}
        </AppText>
        <AppText variant="small">
          {fix
            ? `Fixed from ${fix.fromReports.length} posts · error area ${areaText(fix.errorAreaM2)}${fix.warnings.length ? ' · see the warnings' : ''}`
            : 'No fix yet'}
        </AppText>
      </Card>
    </Pressable>
  );
}

/** Opening an incident: the site and a title; then its page, where bearings are reported. */
function OpenIncidentForm({ siteChoices, onCancel }: { siteChoices: { id: string; name: string }[]; onCancel: () => void }) {
  const router = useRouter();
  const open = useOpenIncident();
  const [formError, setFormError] = useState('');
  const { control, handleSubmit, setError } = useForm<IncidentCreate>({
    resolver: zodResolver(IncidentCreateSchema),
    defaultValues: { siteId: siteChoices.length === 1 ? siteChoices[0]!.id : '', title: '' },
  });
  const onSubmit = handleSubmit((input) => {
    setFormError('');
    open.mutate(input, {
      onSuccess: (detail) => router.navigate({ pathname: '/incidents/[incidentId]', params: { incidentId: detail.incident.id } }),
      onError: (e) => setFormError(applyServerErrors(e, setError, ['siteId', 'title'])),
    });
  });
  return (
    <Card style={{ gap: space.md }} aria-label="Open an incident">
      <AppText variant="heading">Open an incident</AppText>
      <FormChipChoice control={control} name="siteId" label="Site" options={siteChoices} />
      <FormTextField
        control={control}
        name="title"
        label="Title"
        placeholder="e.g. Smoke north of Crane Knoll"
        onSubmitEditing={() => void onSubmit()}
      />
      <FormError message={formError} />
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button label="Open" onPress={() => void onSubmit()} busy={open.isPending} />
        <Button label="Cancel" kind="secondary" onPress={onCancel} disabled={open.isPending} />
      </View>
    </Card>
  );
}
