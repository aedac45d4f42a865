import { Screen } from '@/components/ui/screen';
import { Heading, AppText } from '@/components/ui/text';
import { TextLink } from '@/components/ui/text-link';

export function NotFoundScreen() {
  return (
    <Screen testID="screen-not-found" title="Page not found" width="form" centered>
      <Heading>Page not found</Heading>
      <AppText>There is nothing at this address. It may have moved, or the link may be mistyped.</AppText>
      <TextLink href="/" label="Go to your tanks" testID="not-found-home" />
    </Screen>
  );
}
