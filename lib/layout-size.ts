import { breakpoints } from '@/constants/theme';

export type LayoutSize = 'phone' | 'tablet' | 'wide';

/** Layout size from the window width only: it says nothing about touch or mouse. */
export function layoutSizeForWidth(width: number): LayoutSize {
  if (width >= breakpoints.wide) return 'wide';
  if (width >= breakpoints.tablet) return 'tablet';
  return 'phone';
}
