import type { ReactNode } from 'react';
import { Pressable, type PressableProps, type StyleProp, type ViewStyle } from 'react-native';
import { Link, type Href } from 'expo-router';

/** Pressable state; react-native-web adds hovered and focused, React Native's type lists only pressed. */
export type InteractionState = { pressed: boolean; hovered?: boolean; focused?: boolean };

export interface PressableLinkProps extends Omit<PressableProps, 'style' | 'children'> {
  href: Href;
  /** Style from the press / hover / focus state. */
  style: (state: InteractionState) => StyleProp<ViewStyle>;
  children: ReactNode;
}

/**
 * A block link (an <a> on the web) that styles itself by press, hover and focus state.
 * Link's `asChild` merges styles as plain objects and would drop a style function, so the
 * function lives one level down, in `StatefulPressable`.
 */
export function PressableLink({ href, style, children, ...rest }: PressableLinkProps) {
  return (
    <Link href={href} asChild>
      <StatefulPressable styleForState={style} {...rest}>
        {children}
      </StatefulPressable>
    </Link>
  );
}

function StatefulPressable({
  styleForState,
  style,
  ...rest
}: Omit<PressableProps, 'style'> & { styleForState: PressableLinkProps['style']; style?: StyleProp<ViewStyle> }) {
  return <Pressable {...rest} style={(state) => [style, styleForState(state as InteractionState)]} />;
}
