import { useState, type ReactNode } from 'react';
import { View } from 'react-native';
import { QueryClientProvider } from '@tanstack/react-query';
import { StatusBar } from 'expo-status-bar';
import { useFonts } from 'expo-font';
import { fontSources } from '@/constants/fonts';
import { createQueryClient } from '@/lib/query-client';
import { useTheme } from '@/hooks/use-theme';
import { ThemeProvider } from '@/components/ui/theme-provider';

/**
 * Everything the routes share: data cache, fonts, theme. The app renders at once in the system
 * font and switches when the bundled font arrives; if the font fails it simply stays on the
 * system font, so a slow or broken font request never leaves a blank page.
 */
export function AppProviders({ children }: { children: ReactNode }) {
  const [fontsLoaded, fontError] = useFonts(fontSources);
  const [queryClient] = useState(createQueryClient);
  return (
    <QueryClientProvider client={queryClient}>
      <ThemeProvider appFontActive={fontsLoaded && !fontError}>
        <PageBackground>{children}</PageBackground>
      </ThemeProvider>
    </QueryClientProvider>
  );
}

function PageBackground({ children }: { children: ReactNode }) {
  const { colors, scheme } = useTheme();
  return (
    <View style={{ flex: 1, backgroundColor: colors.background }}>
      <StatusBar style={scheme === 'dark' ? 'light' : 'dark'} />
      {children}
    </View>
  );
}
