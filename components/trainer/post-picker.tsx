import { useState } from 'react';
import { View } from 'react-native';
import { useQuery } from '@tanstack/react-query';
import { sitePostsQuery, useSites } from '@/components/data/sites';
import { Chip, ChipRow } from '@/components/ui/chip';
import { space } from '@/components/ui/theme';

/** Posts of the organisation's sites as chips: a site first, then its posts (several may be chosen when `multiple`). */
export function PostPicker({
  value,
  onChange,
  multiple = false,
}: {
  value: string[];
  onChange: (ids: string[]) => void;
  multiple?: boolean;
}) {
  const sites = useSites();
  const [siteId, setSiteId] = useState<string | null>(null);
  const chosenSite = siteId ?? sites.data?.items[0]?.id ?? null;
  const posts = useSitePostsOf(chosenSite);
  return (
    <View style={{ gap: space.sm }}>
      <ChipRow label="Site">
        {(sites.data?.items ?? []).map((s) => (
          <Chip key={s.id} label={s.name} on={s.id === chosenSite} onPress={() => setSiteId(s.id)} />
        ))}
      </ChipRow>
      <ChipRow label={multiple ? 'Posts (none: open water)' : 'Post (none: open water)'}>
        {posts.map((p) => {
          const on = value.includes(p.id);
          return (
            <Chip
              key={p.id}
              label={p.name}
              on={on}
              onPress={() => onChange(on ? value.filter((id) => id !== p.id) : multiple ? [...value, p.id] : [p.id])}
            />
          );
        })}
      </ChipRow>
    </View>
  );
}

function useSitePostsOf(siteId: string | null) {
  const posts = useQuery({ ...sitePostsQuery(siteId ?? ''), enabled: siteId !== null });
  return siteId ? (posts.data ?? []) : [];
}
