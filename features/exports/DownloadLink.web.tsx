import type { ComponentProps } from 'react';
import { StyleSheet, Text as RNText } from 'react-native';
import { colors, fonts } from '../ui/theme';

interface Props {
  href: string;
  label: string;
  /** Save to disk (a cut file) or open in a new tab (the printable sheet). */
  mode: 'download' | 'open';
  testID?: string;
}

// react-native-web renders a Text with href as an anchor; its extra props are not in React Native's types.
type AnchorText = ComponentProps<typeof RNText> & { href: string; hrefAttrs: Record<string, string | boolean> };
const Anchor = RNText as unknown as (props: AnchorText) => React.JSX.Element;

/** A plain link the browser follows itself, so the server's file name and session cookie apply. */
export function DownloadLink({ href, label, mode, testID }: Props) {
  const hrefAttrs: Record<string, string | boolean> = mode === 'download' ? { download: true } : { target: '_blank', rel: 'noopener' };
  return <Anchor href={href} hrefAttrs={hrefAttrs} style={styles.link} testID={testID}>{label}</Anchor>;
}

const styles = StyleSheet.create({
  link: { fontFamily: fonts.semibold, fontSize: 15, lineHeight: 22, color: colors.accent, textDecorationLine: 'underline' },
});
