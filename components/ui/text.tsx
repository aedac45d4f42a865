import { Text, type TextProps } from 'react-native';
import type { ColorToken, TypeVariant } from '@/constants/theme';
import { useTheme } from '@/hooks/use-theme';

export interface AppTextProps extends TextProps {
  variant?: TypeVariant;
  tone?: ColorToken;
  weight?: 'regular' | 'bold';
}

/** Text in the app's type scale and colours. */
export function AppText({ variant = 'body', tone = 'text', weight = 'regular', style, ...rest }: AppTextProps) {
  const theme = useTheme();
  return <Text style={[theme.type[variant], theme.font[weight], { color: theme.colors[tone] }, style]} {...rest} />;
}

export interface HeadingProps extends AppTextProps {
  level?: 1 | 2 | 3;
}

const variantForLevel = { 1: 'heading', 2: 'title', 3: 'label' } as const;

/** A heading that assistive tech announces with its level (h1–h3 on the web). */
export function Heading({ level = 1, variant, weight = 'bold', ...rest }: HeadingProps) {
  // react-native-web reads aria-level; React Native's types do not list it yet.
  const ariaLevel = { 'aria-level': level } as object;
  return <AppText role="heading" variant={variant ?? variantForLevel[level]} weight={weight} {...ariaLevel} {...rest} />;
}
