import { useRouter } from 'expo-router';
import { Pressable } from 'react-native';
import { useSite } from '@/components/data/sites';
import { AppText } from '@/components/ui/app-text';
import { Screen } from '@/components/ui/screen';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { RequirePlanner } from './require-planner';
import { SiteDelete } from './site-delete';
import { SiteForm } from './site-form';

/** Editing a site: its form (saved with the version loaded) and, below, deleting it. */
export function SiteEditScreen({ siteId }: { siteId: string }) {
  const site = useSite(siteId);
  const router = useRouter();
  if (site.isPending) return <LoadingState label="Loading the site…" />;
  if (site.isError) return <ErrorState error={site.error} onRetry={() => void site.refetch()} />;
  return (
    <Screen
      title={`Edit ${site.data.name}`}
      maxWidth={820}
      actions={
        <Pressable
          role="link"
          onPress={() => router.navigate({ pathname: '/sites/[siteId]', params: { siteId } })}
          style={{ minHeight: 44, justifyContent: 'center', paddingHorizontal: space.xs }}
        >
          <AppText variant="label" tone="ember">
            ‹ Back to the site
          </AppText>
        </Pressable>
      }
    >
      <RequirePlanner what="edit sites">
        {/* A new version (after a reload) starts the form afresh from it. */}
        <SiteForm key={site.data.version} site={site.data} onReload={() => void site.refetch()} />
        <SiteDelete site={site.data} />
      </RequirePlanner>
    </Screen>
  );
}
