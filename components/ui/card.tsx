import type { ReactNode } from 'react';
import { View, type ViewProps } from 'react-native';
import { useTheme } from '@/hooks/use-theme';

export interface CardProps extends ViewProps {
  children: ReactNode;
}

/** A bordered surface grouping one thing (a tank, a section of a page). */
export function Card({ children, style, ...rest }: CardProps) {
  const { colors, radii, space } = useTheme();
  return (
    <View
      style={[
        {
          backgroundColor: colors.surface,
          borderColor: colors.border,
          borderWidth: 1,
          borderRadius: radii.lg,
          padding: space.lg,
          gap: space.sm,
        },
        style,
      ]}
      {...rest}
    >
      {children}
    </View>
  );
}
