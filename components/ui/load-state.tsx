import { ActivityIndicator, View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';

/** A spinner with words, for a page whose data is on its way. */
export function Loading({ label, testID }: { label: string; testID?: string }) {
  const { colors, space } = useTheme();
  return (
    <View testID={testID} style={{ alignItems: 'center', gap: space.md, paddingVertical: space.xxl }}>
      <ActivityIndicator size="large" color={colors.primary} accessibilityLabel={label} />
      <AppText tone="textMuted" accessibilityLiveRegion="polite">
        {label}
      </AppText>
    </View>
  );
}

/** A failed load: what failed, the server's words, and a way to try again. */
export function LoadError({
  title,
  error,
  onRetry,
  retrying = false,
  testID,
}: {
  title: string;
  error: unknown;
  onRetry: () => void;
  retrying?: boolean;
  testID?: string;
}) {
  const message = error instanceof Error ? error.message : 'Something went wrong.';
  return (
    <Banner tone="danger" title={title} message={message} testID={testID}>
      <Button label="Try again" variant="secondary" busy={retrying} busyLabel="Trying again…" onPress={onRetry} />
    </Banner>
  );
}
