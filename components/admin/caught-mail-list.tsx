import { useState } from 'react';
import { Pressable, View } from 'react-native';
import { useCaughtMail } from '@/components/data/caught-mail';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { colors, space } from '@/components/ui/theme';

/** The demo's outgoing mail, caught on this machine instead of being delivered. */
export function CaughtMailList() {
  const mail = useCaughtMail();
  const [open, setOpen] = useState<string | null>(null);
  return (
    <Screen
      title="Mail"
      subtitle="Messages Kenning sent to people in your organisation. On this server they are caught locally, not delivered."
      actions={<Button kind="secondary" label="Refresh" onPress={() => void mail.refetch()} busy={mail.isFetching} />}
      maxWidth={860}
    >
      {mail.isPending ? (
        <LoadingState label="Loading mail…" />
      ) : mail.isError ? (
        <ErrorState error={mail.error} onRetry={() => void mail.refetch()} />
      ) : mail.data.length === 0 ? (
        <EmptyState
          title="No mail yet"
          body="Invitations, plan submissions and review decisions appear here once they are sent."
        />
      ) : (
        <View style={{ gap: space.sm }}>
          <Notice tone="info">
            <AppText variant="small">Newest first. Links in these messages work on this server.</AppText>
          </Notice>
          {mail.data.map((m) => (
            <Card key={m.id}>
              <Pressable
                role="button"
                aria-expanded={open === m.id}
                onPress={() => setOpen(open === m.id ? null : m.id)}
                style={{ gap: 2, minHeight: 44 }}
              >
                <AppText variant="heading">{m.subject}</AppText>
                <AppText variant="small" tone="muted">
                  To {m.to.join(', ')} · {new Date(m.receivedAt).toLocaleString()}
                </AppText>
              </Pressable>
              {open === m.id ? (
                <AppText selectable style={{ borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.sm }}>
                  {m.text}
                </AppText>
              ) : null}
            </Card>
          ))}
        </View>
      )}
    </Screen>
  );
}
