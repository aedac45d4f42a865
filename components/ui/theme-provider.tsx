import type { ReactNode } from 'react';
import { FontStatusContext } from '@/hooks/use-theme';

/** Tells every `useTheme()` below whether the bundled font is ready. Colours follow the system. */
export function ThemeProvider({ appFontActive, children }: { appFontActive: boolean; children: ReactNode }) {
  return <FontStatusContext.Provider value={appFontActive}>{children}</FontStatusContext.Provider>;
}
