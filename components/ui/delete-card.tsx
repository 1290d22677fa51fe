import { useState } from 'react';
import { View } from 'react-native';
import { AppText } from './app-text';
import { Button } from './button';
import { Card } from './card';
import { Notice } from './states';
import { space } from './theme';

/**
 * Deleting a record, asked twice: what deleting does, the server's refusal
 * (its reason) when there is one, and "Yes, delete the …" / "Keep it".
 */
export function DeleteCard({
  noun,
  name,
  explanation,
  remove,
  onDeleted,
}: {
  /** "post", "site". */
  noun: string;
  /** The record's name, for the question. */
  name: string;
  /** What deleting does and when the server refuses it. */
  explanation: string;
  remove: { error: Error | null; isPending: boolean; mutateAsync: () => Promise<unknown> };
  /** Where to go once deleted. */
  onDeleted: () => void;
}) {
  const [asking, setAsking] = useState(false);
  return (
    <Card aria-label={`Delete this ${noun}`} style={{ gap: space.sm }}>
      <AppText variant="heading">Delete this {noun}</AppText>
      <AppText tone="muted">{explanation}</AppText>
      {remove.error ? (
        <Notice tone="danger" title="Not deleted">
          <AppText>{remove.error.message}</AppText>
        </Notice>
      ) : null}
      {asking ? (
        <View style={{ gap: space.sm }}>
          <AppText>Delete “{name}”?</AppText>
          <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
            <Button
              kind="danger"
              label={`Yes, delete the ${noun}`}
              busy={remove.isPending}
              // mutateAsync: the screen may unmount this card when the record goes, before a per-call callback ran.
              onPress={() => remove.mutateAsync().then(onDeleted, () => setAsking(false))}
            />
            <Button kind="quiet" label="Keep it" onPress={() => setAsking(false)} />
          </View>
        </View>
      ) : (
        <Button kind="secondary" label={`Delete ${noun}…`} onPress={() => setAsking(true)} style={{ alignSelf: 'flex-start' }} />
      )}
    </Card>
  );
}
