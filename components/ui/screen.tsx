import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { SafeAreaView, type Edge } from 'react-native-safe-area-context';
import Head from 'expo-router/head';
import { useTheme } from '@/hooks/use-theme';

export interface ScreenProps {
  testID: string;
  /** The page's name, shown in the browser tab and read first by screen readers on the web. */
  title: string;
  children: ReactNode;
  /** `form` narrows the column for sign-in style pages; `content` fits lists and tables. */
  width?: 'content' | 'form';
  /** Safe-area edges this screen must keep clear of; the app shell handles the bottom bar's edge. */
  edges?: readonly Edge[];
  /** Centre the column vertically when it is shorter than the window (auth pages). */
  centered?: boolean;
}

/** A page: safe area, the page colour, a scrolling column capped at a readable width. */
export function Screen({ testID, title, children, width = 'content', edges = ['top', 'left', 'right'], centered = false }: ScreenProps) {
  const { colors, space, layout } = useTheme();
  const maxWidth = width === 'form' ? layout.maxFormWidth : layout.maxContentWidth;
  return (
    <SafeAreaView edges={edges} style={[styles.fill, { backgroundColor: colors.background }]}>
      <Head>
        <title>{`${title} · Shoalshift`}</title>
      </Head>
      <ScrollView
        testID={testID}
        style={styles.fill}
        contentContainerStyle={[
          styles.scrollContent,
          { padding: space.lg, paddingBottom: space.xxl },
          centered && styles.centered,
        ]}
        keyboardShouldPersistTaps="handled"
      >
        <View style={[styles.column, { maxWidth, gap: space.lg }]}>{children}</View>
      </ScrollView>
    </SafeAreaView>
  );
}

const styles = StyleSheet.create({
  fill: { flex: 1 },
  scrollContent: { flexGrow: 1, alignItems: 'center' },
  centered: { justifyContent: 'center' },
  column: { width: '100%' },
});
