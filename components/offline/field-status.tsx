import { onlineManager, useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useState, useSyncExternalStore } from 'react';
import { Platform, StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { colors, space } from '@/components/ui/theme';
import { deviceOutbox, onOutboxChange } from './device-outbox';
import type { OutboxItem } from './outbox';
import { registerServiceWorker } from './register-service-worker';

/** While items wait, sending is tried again this often (and at once when the network returns). */
const RETRY_MS = 20_000;

/** Whether the browser says it has a network (TanStack Query's view of it, which pauses queries offline). */
export function useOnline(): boolean {
  return useSyncExternalStore(
    (notify) => onlineManager.subscribe(notify),
    () => onlineManager.isOnline(),
    () => true,
  );
}

/** The device's outbox as it stands, refreshed on every change. */
export function useOutboxItems(): OutboxItem[] {
  const [items, setItems] = useState<OutboxItem[]>([]);
  useEffect(() => {
    let live = true;
    const load = () => void deviceOutbox.list().then((list) => live && setItems(list));
    load();
    const stop = onOutboxChange(load);
    return () => {
      live = false;
      stop();
    };
  }, []);
  return items;
}

/** Sends what waits in the outbox and refreshes what each delivered item changed (the runner and "Send now" alike). */
function useSendOutbox(): () => Promise<void> {
  const qc = useQueryClient();
  return useCallback(async () => {
    const delivered = await deviceOutbox.flush();
    for (const item of delivered) for (const key of item.refresh) void qc.invalidateQueries({ queryKey: [...key] });
  }, [qc]);
}

/**
 * Sends what waits in the outbox: at start, when the network returns, and
 * every {@link RETRY_MS} while something waits; refreshes what a delivered
 * item changed (an incident's fix, a course's results).
 */
export function OutboxRunner() {
  const sendWaiting = useSendOutbox();
  const online = useOnline();
  const waiting = useOutboxItems().filter((i) => i.state === 'waiting').length;
  useEffect(() => {
    if (!online) return;
    void sendWaiting();
    if (waiting === 0) return;
    const timer = setInterval(() => void sendWaiting(), RETRY_MS);
    return () => clearInterval(timer);
  }, [online, waiting, sendWaiting]);
  return null;
}

/** The newest time any shown data was fetched (what the device's copies date from). */
function useLastUpdate(): number | null {
  const qc = useQueryClient();
  const online = useOnline();
  const [at, setAt] = useState<number | null>(null);
  useEffect(() => {
    if (online) return;
    const newest = qc
      .getQueryCache()
      .getAll()
      .reduce((t, q) => Math.max(t, q.state.dataUpdatedAt), 0);
    setAt(newest || null);
  }, [online, qc]);
  return at;
}

const clock = (ms: number) => {
  const d = new Date(ms);
  const sameDay = d.toDateString() === new Date().toDateString();
  const time = d.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });
  return sameDay ? time : `${d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short' })} ${time}`;
};

/** A band over every signed-in page while the device has no network. */
export function OfflineBand() {
  const online = useOnline();
  const last = useLastUpdate();
  const waiting = useOutboxItems().filter((i) => i.state === 'waiting').length;
  if (online) return null;
  return (
    <View style={styles.band} role="status" aria-live="polite" aria-label="Offline">
      <AppText variant="label" style={{ color: colors.ink }}>
        Offline
        {last ? ` · showing what this device kept, last updated ${clock(last)}` : ' · nothing kept on this device yet'}
      </AppText>
      <AppText variant="small" style={{ color: colors.ink }}>
        {waiting > 0
          ? `${waiting} ${waiting === 1 ? 'report waits' : 'reports wait'} on this device and will be sent when the network is back.`
          : 'What you send waits on this device and goes when the network is back.'}
      </AppText>
    </View>
  );
}

/**
 * The shell's field-mode part: the offline band and the outbox's sender. It
 * lives in the deferred chunk (the first screen does not wait for it); the
 * service worker keeps that chunk on the device, so it loads offline too.
 */
export function FieldStatus({ part }: { part: 'band' | 'sender' }) {
  // The worker is registered once a person is signed in (field mode is for the signed-in app).
  useEffect(() => {
    if (part === 'sender' && Platform.OS === 'web') registerServiceWorker();
  }, [part]);
  return part === 'band' ? <OfflineBand /> : <OutboxRunner />;
}

const STATE_TEXT: Record<OutboxItem['state'], string> = {
  waiting: 'Waiting to be sent',
  sent: 'Sent',
  refused: 'Not accepted',
};

/** The outbox for people: each item, where it stands, and for a refused one the server's reason. */
export function OutboxList({ title = 'Sent from this device' }: { title?: string }) {
  const items = useOutboxItems();
  const online = useOnline();
  const sendWaiting = useSendOutbox();
  const [busy, setBusy] = useState(false);
  if (items.length === 0) return null;
  const waiting = items.some((i) => i.state === 'waiting');
  const sorted = [...items].sort((a, b) => b.createdAt.localeCompare(a.createdAt));
  return (
    <Card aria-label="Outbox">
      <AppText variant="heading">{title}</AppText>
      {sorted.map((i) => (
        <View key={i.key} style={styles.row}>
          <AppText variant="label">{i.label}</AppText>
          <AppText variant="small" tone={i.state === 'refused' ? 'danger' : i.state === 'sent' ? 'moss' : 'muted'}>
            {STATE_TEXT[i.state]}
            {i.state === 'sent' && i.settledAt ? ` at ${clock(Date.parse(i.settledAt))}` : ''}
            {i.state === 'waiting' ? ` since ${clock(Date.parse(i.createdAt))}` : ''}
            {i.state === 'waiting' && i.lastProblem && online ? ` — ${i.lastProblem}` : ''}
            {i.state === 'refused' && i.refusal ? `: ${i.refusal}` : ''}
          </AppText>
        </View>
      ))}
      {waiting && online ? (
        <Button
          kind="secondary"
          label="Send now"
          busy={busy}
          onPress={() => {
            setBusy(true);
            void sendWaiting().finally(() => setBusy(false));
          }}
          style={{ alignSelf: 'flex-start' }}
        />
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  band: {
    backgroundColor: colors.cautionSoft,
    borderBottomColor: colors.cautionLine,
    borderBottomWidth: 2,
    paddingHorizontal: space.lg,
    paddingVertical: space.sm,
    gap: 2,
  },
  row: { gap: 2, paddingVertical: space.xs, borderTopWidth: StyleSheet.hairlineWidth, borderTopColor: colors.line },
});
