import { Linking, Platform, Pressable } from 'react-native';
import { AppText } from '@/components/ui/app-text';
import { colors, radius, space, TOUCH } from '@/components/ui/theme';

/**
 * A link that downloads a file the API makes (a PDF). On the web it is a real
 * `<a href download>` (react-native-web renders `href`), so the browser saves
 * the file with the name the server gives and the page stays; elsewhere it
 * opens the address.
 */
export function DownloadLink({ href, label }: { href: string; label: string }) {
  const web = Platform.OS === 'web';
  const anchor = web ? ({ href, hrefAttrs: { download: '' } } as object) : {};
  return (
    <Pressable
      role="link"
      aria-label={label}
      {...anchor}
      onPress={web ? undefined : () => void Linking.openURL(href)}
      style={({ pressed }) => ({
        minHeight: TOUCH,
        justifyContent: 'center',
        paddingHorizontal: space.md,
        borderRadius: radius.md,
        borderWidth: 1.5,
        borderColor: colors.lineStrong,
        backgroundColor: pressed ? colors.paper : colors.surface,
        alignSelf: 'flex-start',
      })}
    >
      <AppText variant="label" style={{ fontSize: 16 }}>
        {label}
      </AppText>
    </Pressable>
  );
}
