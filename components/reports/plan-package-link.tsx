import { useState } from 'react';
import { View } from 'react-native';
import { useCoordinateFormat } from '@/components/map/coordinate-format';
import { AppText } from '@/components/ui/app-text';
import { Chip } from '@/components/ui/chip';
import { space } from '@/components/ui/theme';
import { DownloadLink } from './download-link';

type Paper = 'a4' | 'letter';

/** The package's address: a frozen revision's, or the draft preview's when `revision` is null. */
export function planPackageUrl(planId: string, revision: number | null, paper: Paper, coords: string) {
  const query = `?paper=${paper}&coords=${coords}`;
  return revision === null
    ? `/api/v1/plans/${planId}/preview/report.pdf${query}`
    : `/api/v1/plans/${planId}/revisions/${revision}/report.pdf${query}`;
}

/**
 * "Download plan package (PDF)" for a frozen revision, or a watermarked draft
 * preview while the plan can change; A4 or US Letter; positions in the
 * coordinate format the person chose on the map. `revision` undefined: not
 * known yet (nothing is shown).
 */
export function PlanPackageLink({ planId, revision }: { planId: string; revision: number | null | undefined }) {
  const [paper, setPaper] = useState<Paper>('a4');
  const [coords] = useCoordinateFormat();
  // A frozen plan whose revision is not known yet: nothing to link to until it is.
  if (revision === undefined) return null;
  return (
    <View style={{ gap: space.xs }} role="group" aria-label="Plan package">
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm }}>
        <DownloadLink
          href={planPackageUrl(planId, revision, paper, coords)}
          label={revision === null ? 'Download draft preview (PDF)' : 'Download plan package (PDF)'}
        />
        <Chip label="A4" on={paper === 'a4'} onPress={() => setPaper('a4')} />
        <Chip label="US Letter" on={paper === 'letter'} onPress={() => setPaper('letter')} />
      </View>
      <AppText variant="small" tone="muted">
        {revision === null
          ? 'A preview of the figures as they stand, marked “draft — not approved”.'
          : `Revision ${revision}: cover with signatures and content hash, assumptions, maps, tables and cautions.`}
      </AppText>
    </View>
  );
}
