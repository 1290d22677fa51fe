import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/states';

/** The version-conflict message of the library forms: someone else saved first; what was typed stays. */
export function StaleNotice({ what, onReload }: { what: string; onReload: () => void }) {
  return (
    <Notice tone="danger" title={`Not saved: this ${what} changed`}>
      <AppText>
        Someone else saved this {what} after you opened it, so your changes were not saved. What you typed is still here: reload
        to see their version (your form starts again from it), then make your change again.
      </AppText>
      <Button kind="secondary" label={`Reload the ${what}`} onPress={onReload} />
    </Notice>
  );
}
