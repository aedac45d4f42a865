import type { ReactNode } from 'react';
import { View } from 'react-native';
import { statusColorTokens, type StatusTone } from '@/constants/theme';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';

export interface BannerProps {
  tone: StatusTone;
  /** A short lead in words ("Could not sign in"), so the tone never rests on colour alone. */
  title: string;
  message?: string;
  children?: ReactNode;
  testID?: string;
}

/** A tinted message box for errors, warnings and confirmations; danger banners are announced. */
export function Banner({ tone, title, message, children, testID }: BannerProps) {
  const { colors, radii, space } = useTheme();
  const { text, surface } = statusColorTokens[tone];
  const urgent = tone === 'danger' || tone === 'watch';
  return (
    <View
      testID={testID}
      accessibilityRole={urgent ? 'alert' : undefined}
      accessibilityLiveRegion={urgent ? 'assertive' : 'polite'}
      style={{
        backgroundColor: colors[surface],
        borderLeftWidth: 4,
        borderLeftColor: colors[text],
        borderRadius: radii.md,
        padding: space.md,
        gap: space.xs,
      }}
    >
      <AppText weight="bold" tone={text}>
        {title}
      </AppText>
      {message ? <AppText tone="text">{message}</AppText> : null}
      {children}
    </View>
  );
}
