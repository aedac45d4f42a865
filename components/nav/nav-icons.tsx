import Svg, { Circle, Path, Rect } from 'react-native-svg';
import type { NavKey } from '@/components/nav/nav-items';

/** Line icons for the navigation; decorative, the label beside them carries the meaning. */
export function NavIcon({ name, color, size = 24 }: { name: NavKey; color: string; size?: number }) {
  const common = { stroke: color, strokeWidth: 2, fill: 'none', strokeLinecap: 'round', strokeLinejoin: 'round' } as const;
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24" accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      {name === 'settings' ? (
        <>
          <Path d="M4 7 h16 M4 17 h16" {...common} />
          <Circle cx={9} cy={7} r={2.5} {...common} />
          <Circle cx={15} cy={17} r={2.5} {...common} />
        </>
      ) : name === 'plans' ? (
        <>
          <Path d="M4 19 L4 5 M4 19 L20 19" {...common} />
          <Path d="M7 15 q3 -9 6 -4 t6 -5" {...common} />
        </>
      ) : name === 'tanks' ? (
        <>
          <Rect x={3} y={5} width={18} height={14} rx={2} {...common} />
          <Path d="M3 10 q3 -2 6 0 t6 0 t6 0" {...common} />
          <Path d="M9 15 l2 -1.5 l0 3 z M11 15 q2 -2 4 0 q-2 2 -4 0" {...common} />
        </>
      ) : (
        <>
          <Circle cx={12} cy={8} r={4} {...common} />
          <Path d="M4 20 c0 -4 4 -6 8 -6 s8 2 8 6" {...common} />
        </>
      )}
    </Svg>
  );
}
