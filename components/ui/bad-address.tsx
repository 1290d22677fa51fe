import { AppText } from './app-text';
import { Screen } from './screen';
import { Notice } from './states';

/** Shown when a route's parameters do not name anything (a mistyped or truncated link). */
export function BadAddress({ title, what }: { title: string; what: string }) {
  return (
    <Screen title={title}>
      <Notice tone="danger">
        <AppText>This address does not name {what}. Check the link, or go back and pick it from the list.</AppText>
      </Notice>
    </Screen>
  );
}
