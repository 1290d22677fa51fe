import { View } from 'react-native';
import { AppText } from './app-text';
import { Button } from './button';
import { space } from './theme';

/** Previous / next through a paged list, with where we are. Renders nothing for a single page. */
export function Pager({
  page,
  pageSize,
  total,
  onPage,
}: {
  page: number;
  pageSize: number;
  total: number;
  onPage: (page: number) => void;
}) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  if (pages <= 1) return null;
  return (
    <View
      role="navigation"
      aria-label="Pages"
      style={{ flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.md }}
    >
      <Button kind="secondary" label="Previous" disabled={page <= 1} onPress={() => onPage(page - 1)} />
      <AppText tone="muted">
        Page {page} of {pages} · {total} in all
      </AppText>
      <Button kind="secondary" label="Next" disabled={page >= pages} onPress={() => onPage(page + 1)} />
    </View>
  );
}
