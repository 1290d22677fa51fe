import { AppText } from './app-text';

/** The error under a field or a group of choices (announced to screen readers); nothing when there is none. */
export function FieldError({ message }: { message?: string | null }) {
  return message ? (
    <AppText variant="small" tone="danger" role="alert">
      {message}
    </AppText>
  ) : null;
}
