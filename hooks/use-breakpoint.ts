import { useWindowDimensions } from 'react-native';
import { layoutSizeForWidth, type LayoutSize } from '@/lib/layout-size';

/** phone / tablet / wide for the current window width. */
export function useLayoutSize(): LayoutSize {
  return layoutSizeForWidth(useWindowDimensions().width);
}
