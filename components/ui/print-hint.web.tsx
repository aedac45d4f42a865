import { View, type ViewProps } from 'react-native';
import type { PrintHintKind, PrintHintProps } from './print-hint';

export type { PrintHintKind, PrintHintProps };

// react-native-web turns `dataSet` into data-* attributes; React Native's types do not list it.
const WebView = View as unknown as (props: ViewProps & { dataSet?: Record<string, string> }) => React.ReactElement;

/** A View marked `data-print="…"`: public/index.html's print rules hide, stack or keep it together. */
export function PrintHint({ hint, ...rest }: PrintHintProps) {
  return <WebView {...rest} dataSet={{ print: hint }} />;
}
