import { SiteForm } from '@/components/sites/site-form';
import { RequirePlanner } from '@/components/sites/require-planner';
import { Screen } from '@/components/ui/screen';

/** A new site: its name and kind, then its boundary and the zones that matter most (planners only). */
export function NewSiteScreen() {
  return (
    <Screen
      title="New site"
      subtitle="Name it, say what kind it is, then give its boundary and the zones that matter most."
      maxWidth={820}
    >
      <RequirePlanner what="create sites">
        <SiteForm />
      </RequirePlanner>
    </Screen>
  );
}
