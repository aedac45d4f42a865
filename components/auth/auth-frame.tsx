import type { ReactNode } from 'react';
import { View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { BrandMark } from '@/components/ui/brand-mark';
import { AppText, Heading } from '@/components/ui/text';

/** The shared look of the sign-in pages: the mark, a heading, a line of context, the form card. */
export function AuthFrame({
  testID,
  title,
  lead,
  children,
  footer,
}: {
  testID: string;
  title: string;
  lead?: string;
  children: ReactNode;
  footer?: ReactNode;
}) {
  const { space } = useTheme();
  return (
    <Screen testID={testID} title={title} width="form" centered edges={['top', 'bottom', 'left', 'right']}>
      <BrandMark />
      <View style={{ gap: space.xs }}>
        <Heading>{title}</Heading>
        {lead ? <AppText tone="textMuted">{lead}</AppText> : null}
      </View>
      <Card style={{ gap: space.lg, padding: space.xl }}>{children}</Card>
      {footer ? <View style={{ gap: space.xs }}>{footer}</View> : null}
    </Screen>
  );
}
