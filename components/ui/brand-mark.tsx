import { View } from 'react-native';
import Svg, { Path, Rect } from 'react-native-svg';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';

/** Shoalshift's mark: three stacked swells in a rounded tile, with the name beside it. */
export function BrandMark({ size = 32, showName = true }: { size?: number; showName?: boolean }) {
  const { colors, space } = useTheme();
  return (
    <View
      style={{ flexDirection: 'row', alignItems: 'center', gap: space.sm }}
      accessible
      accessibilityLabel="Shoalshift"
      accessibilityRole="image"
    >
      <Svg width={size} height={size} viewBox="0 0 32 32" accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
        <Rect x={0} y={0} width={32} height={32} rx={8} fill={colors.primary} />
        {[10, 16, 22].map((y, i) => (
          <Path
            key={y}
            d={`M6 ${y} q5 -${4 - i} 10 0 t10 0`}
            stroke={colors.onPrimary}
            strokeWidth={2.4}
            strokeLinecap="round"
            fill="none"
            opacity={1 - i * 0.25}
          />
        ))}
      </Svg>
      {showName ? (
        <AppText variant="title" weight="bold" importantForAccessibility="no" accessibilityElementsHidden>
          Shoalshift
        </AppText>
      ) : null}
    </View>
  );
}
