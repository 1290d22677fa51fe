import { useRouter } from 'expo-router';
import type { Site } from '@/shared/schemas/site';
import { useDeleteSite } from '@/components/data/sites';
import { DeleteCard } from '@/components/ui/delete-card';

/**
 * Deleting a site, asked twice. The server keeps a site that approved plans
 * depend on (409 `site_has_approved_plans`); its reason shows here.
 */
export function SiteDelete({ site }: { site: Site }) {
  const router = useRouter();
  const remove = useDeleteSite(site.id);
  return (
    <DeleteCard
      noun="site"
      name={site.name}
      explanation="The site, its posts and its draft plans leave the lists; their history stays. A site that approved plans depend on cannot be deleted."
      remove={remove}
      onDeleted={() => router.replace('/')}
    />
  );
}
