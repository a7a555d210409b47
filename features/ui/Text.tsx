import { Text as RNText, type TextProps } from 'react-native';
import { colors, fonts } from './theme';

type Variant = 'title' | 'heading' | 'body' | 'label' | 'caption';

const styles: Record<Variant, { fontFamily: string; fontSize: number; lineHeight: number; color: string }> = {
  title: { fontFamily: fonts.bold, fontSize: 26, lineHeight: 32, color: colors.ink },
  heading: { fontFamily: fonts.semibold, fontSize: 18, lineHeight: 24, color: colors.ink },
  body: { fontFamily: fonts.regular, fontSize: 15, lineHeight: 22, color: colors.ink },
  label: { fontFamily: fonts.semibold, fontSize: 13, lineHeight: 18, color: colors.ink },
  caption: { fontFamily: fonts.regular, fontSize: 13, lineHeight: 18, color: colors.muted },
};

/** A screen's title is its top heading and a section's heading the next level, so a screen reader can jump between them. */
const headingLevels: Partial<Record<Variant, number>> = { title: 1, heading: 2 };

export function Text({ variant = 'body', style, ...rest }: TextProps & { variant?: Variant }) {
  const level = headingLevels[variant];
  const role = rest.role ?? (level ? 'heading' : undefined);
  return <RNText {...rest} role={role} aria-level={role === 'heading' ? level : undefined} style={[styles[variant], style]} />;
}
