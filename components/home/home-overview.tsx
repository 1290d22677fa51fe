import { useRouter } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { SITE_KIND_LABELS } from '@/shared/schemas/site-kinds';
import { useSession } from '@/components/data/session';
import { useSites } from '@/components/data/sites';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { SightlineIcon } from '@/components/ui/icons';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { colors, space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';

export function HomeOverview() {
  const { data: user } = useSession();
  const { wide } = useLayout();
  const router = useRouter();
  return (
    <Screen
      title="Your sites"
      subtitle={user ? `${user.organization.name} · signed in as ${user.name}` : undefined}
      actions={
        user?.role === 'planner' ? (
          <Button label="New site" role="link" onPress={() => router.navigate('/sites/new')} />
        ) : undefined
      }
    >
      <View style={{ flexDirection: wide ? 'row' : 'column', gap: space.xl, alignItems: 'flex-start' }}>
        <View style={{ flex: wide ? 2 : undefined, width: wide ? undefined : '100%', gap: space.md }}>
          <SiteList />
        </View>
        <View style={{ flex: wide ? 1 : undefined, width: wide ? undefined : '100%', gap: space.md }}>
          <Pressable role="link" onPress={() => router.navigate('/check')}>
            <Card accent="ember">
              <View style={{ flexDirection: 'row', alignItems: 'center', gap: space.sm }}>
                <SightlineIcon color={colors.ember} />
                <AppText variant="heading">Quick check</AppText>
              </View>
              <AppText tone="muted">
                Horizon, dip, hidden height and detection range for one height of eye and one target, under several refraction
                conditions.
              </AppText>
            </Card>
          </Pressable>
          {user?.role === 'admin' || user?.role === 'reviewer' ? (
            <Pressable role="link" aria-label="History" onPress={() => router.navigate('/history')}>
              <Card>
                <AppText variant="heading">History</AppText>
                <AppText tone="muted">
                  Who changed what and when, across the organisation: sites, posts, plans and libraries.
                </AppText>
              </Card>
            </Pressable>
          ) : null}
        </View>
      </View>
    </Screen>
  );
}

function SiteList() {
  const sites = useSites();
  const router = useRouter();
  const { data: user } = useSession();
  if (sites.isPending) return <LoadingState label="Loading sites…" />;
  if (sites.isError) return <ErrorState error={sites.error} onRetry={() => void sites.refetch()} />;
  if (sites.data.items.length === 0) {
    return (
      <EmptyState
        title="No sites yet"
        body={
          user?.role === 'planner'
            ? 'A site is a forest district, a coast stretch or a search area your organisation watches. Start with a new site: name it, draw or import its boundary and mark its priority zones. Then upload its terrain, place posts, and build a coverage plan.'
            : 'A site is a forest district, a coast stretch or a search area your organisation watches. Your planners create the sites; once they have, they appear here.'
        }
        action={
          user?.role === 'planner' ? (
            <Button label="Create the first site" role="link" onPress={() => router.navigate('/sites/new')} />
          ) : undefined
        }
      />
    );
  }
  return (
    <View style={{ gap: space.sm }}>
      {sites.data.items.map((s) => (
        <Pressable
          key={s.id}
          role="link"
          aria-label={s.name}
          onPress={() => router.navigate({ pathname: '/sites/[siteId]', params: { siteId: s.id } })}
        >
          <Card style={styles.row}>
            <AppText variant="heading">{s.name}</AppText>
            <AppText variant="small" tone="muted">
              {SITE_KIND_LABELS[s.kind]} · {s.postCount} post{s.postCount === 1 ? '' : 's'}
            </AppText>
          </Card>
        </Pressable>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({ row: { gap: space.xs } });
