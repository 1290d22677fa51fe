import { Modal, ScrollView, StyleSheet, View } from 'react-native';
import { AppText } from './app-text';
import { Button } from './button';
import { FormError } from './states';
import { colors, radius, space } from './theme';

export interface ConfirmDialogProps {
  /** Whether the dialog is open. */
  visible: boolean;
  /** The question, e.g. "Submit this plan for review?". */
  title: string;
  /** What will happen if the person goes on, in plain words. */
  consequence: string;
  /** The action's own verb, e.g. "Submit"; never a bare "OK". */
  confirmLabel: string;
  cancelLabel?: string;
  /** `danger` for actions that take something away (a person off a watch, an account). */
  tone?: 'primary' | 'danger';
  busy?: boolean;
  /** Why the last attempt failed; the dialog stays open so nothing typed is lost. */
  error?: string;
  /** Keeps the confirm button off until what the dialog asks for is given. */
  confirmDisabled?: boolean;
  onConfirm: () => void;
  onCancel: () => void;
  /** More to read or fill in before deciding (a verdict, a note). */
  children?: React.ReactNode;
}

/**
 * Asks before a consequential action and says what it will do. Escape (web)
 * and the back button (Android) cancel. The page behind stays as it was.
 */
export function ConfirmDialog({
  visible,
  title,
  consequence,
  confirmLabel,
  cancelLabel = 'Cancel',
  tone = 'primary',
  busy,
  error,
  confirmDisabled,
  onConfirm,
  onCancel,
  children,
}: ConfirmDialogProps) {
  return (
    <Modal visible={visible} transparent animationType="none" onRequestClose={onCancel}>
      <View style={styles.backdrop}>
        <View style={styles.sheet} role="dialog" aria-modal aria-label={title}>
          <ScrollView contentContainerStyle={styles.body}>
            <AppText variant="title">{title}</AppText>
            <AppText>{consequence}</AppText>
            {children}
            <FormError message={error ?? ''} />
          </ScrollView>
          <View style={styles.actions}>
            <Button kind="secondary" label={cancelLabel} onPress={onCancel} disabled={busy} />
            <Button
              kind={tone === 'danger' ? 'danger' : 'primary'}
              label={confirmLabel}
              onPress={onConfirm}
              busy={busy}
              disabled={confirmDisabled}
            />
          </View>
        </View>
      </View>
    </Modal>
  );
}

const styles = StyleSheet.create({
  backdrop: {
    flex: 1,
    backgroundColor: 'rgba(23, 37, 43, 0.55)',
    justifyContent: 'center',
    alignItems: 'center',
    padding: space.lg,
  },
  sheet: {
    width: '100%',
    maxWidth: 560,
    maxHeight: '90%',
    backgroundColor: colors.surface,
    borderRadius: radius.lg,
    overflow: 'hidden',
  },
  body: { padding: space.xl, gap: space.md },
  actions: {
    flexDirection: 'row',
    justifyContent: 'flex-end',
    flexWrap: 'wrap',
    gap: space.sm,
    padding: space.lg,
    borderTopWidth: 1,
    borderTopColor: colors.line,
    backgroundColor: colors.paper,
  },
});
