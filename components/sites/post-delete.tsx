import { useRouter } from 'expo-router';
import type { Post } from '@/shared/schemas/site';
import { useDeletePost } from '@/components/data/sites';
import { DeleteCard } from '@/components/ui/delete-card';

/**
 * Deleting a post, asked twice. The server keeps a post that a submitted or
 * approved plan uses (409 `post_in_frozen_plan`); its reason, naming the
 * plans, shows here.
 */
export function PostDelete({ siteId, post }: { siteId: string; post: Post }) {
  const router = useRouter();
  const remove = useDeletePost(siteId, post.id);
  return (
    <DeleteCard
      noun="post"
      name={post.name}
      explanation="The post leaves the site’s lists and maps; its history and photos stay. A post that a submitted or approved plan uses cannot be deleted."
      remove={remove}
      onDeleted={() => router.replace({ pathname: '/sites/[siteId]', params: { siteId } })}
    />
  );
}
