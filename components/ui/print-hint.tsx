import { View, type ViewProps } from 'react-native';

/** How a block behaves on paper: left off, stacked into one column, or kept on one page. */
export type PrintHintKind = 'hide' | 'stack' | 'keep';

export interface PrintHintProps extends ViewProps {
  hint: PrintHintKind;
}

/** A View that tells the browser's print layout what to do with it; on native it is a plain View. */
export function PrintHint({ hint: _hint, ...rest }: PrintHintProps) {
  return <View {...rest} />;
}
