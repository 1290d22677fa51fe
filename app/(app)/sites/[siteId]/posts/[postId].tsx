import { useIdParams } from '@/components/data/route-params';
import { usePost } from '@/components/data/sites';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const PostEditor = deferredScreen('PostEditor');

function PostScreenContent() {
  const ids = useIdParams(['siteId', 'postId']);
  if (!ids) {
    return <BadAddress title="Post" what="a post" />;
  }
  return <PostRoute {...ids} />;
}

function PostRoute({ siteId, postId }: { siteId: string; postId: string }) {
  const post = usePost(siteId, postId);
  if (post.isPending) return <LoadingState label="Loading the post…" />;
  if (post.isError) return <ErrorState error={post.error} onRetry={() => void post.refetch()} />;
  if (!post.data) {
    return (
      <Screen title="Post">
        <EmptyState title="No such post" body="This post was removed, or it belongs to another site." />
      </Screen>
    );
  }
  // Keyed by post: a copy opened from “Duplicate” starts with its own state (its form open).
  return <PostEditor key={postId} siteId={siteId} post={post.data} onReload={() => void post.refetch()} />;
}

/** The tab's title until the page below names itself more precisely. */
export default function PostScreen() {
  return (
    <>
      <PageTitle title={documentTitle('Post')} />
      <PostScreenContent />
    </>
  );
}
