import { SiteForm } from '@/components/sites/site-form';
import { RequirePlanner } from '@/components/sites/require-planner';
import { AppText } from '@/components/ui/app-text';
import { Screen } from '@/components/ui/screen';
import { Notice } from '@/components/ui/states';

/** A new site: its name and kind, then its boundary and the zones that matter most (planners only). */
export function NewSiteScreen() {
  return (
    <Screen
      title="New site"
      subtitle="Name it, say what kind it is, then give its boundary and the zones that matter most."
      maxWidth={820}
    >
      <RequirePlanner what="create sites">
        <Notice tone="info" title="Only a terrain file to hand?">
          <AppText variant="small">
            Leave the boundary empty and create the site. Then upload the terrain on the site’s page and choose “Use the terrain’s
            extent as the boundary”: the boundary becomes the terrain grid’s rectangle, reprojected to WGS 84.
          </AppText>
        </Notice>
        <SiteForm />
      </RequirePlanner>
    </Screen>
  );
}
