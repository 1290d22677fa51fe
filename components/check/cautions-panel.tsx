import { AppText } from '@/components/ui/app-text';
import { Notice } from '@/components/ui/states';

/** The standing cautions; always shown with any result. */
export function CautionsPanel({ cautions }: { cautions: readonly { code: string; message: string }[] }) {
  return (
    <Notice tone="caution" title="Read before you rely on this">
      {cautions.map((c) => (
        <AppText key={c.code} variant="small">
          • {c.message}
        </AppText>
      ))}
    </Notice>
  );
}
