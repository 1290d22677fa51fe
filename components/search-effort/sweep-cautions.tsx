import { AppText } from '@/components/ui/app-text';
import { Notice } from '@/components/ui/states';

/** The standing cautions of the search-effort screen, shown before and with every result. */
export function SweepCautions({ caution }: { caution?: string }) {
  return (
    <Notice tone="caution" title="Estimates only">
      <AppText variant="small">
        •{' '}
        {caution ??
          'POD is an estimate for planning, not a promise. Visibility is not detection — a target within range can still be missed.'}
      </AppText>
      <AppText variant="small">
        • A sweep width holds for one search object, visibility, sea, light and searcher; take it from your agency’s tables and
        follow your agency’s search-planning procedures.
      </AppText>
    </Notice>
  );
}
