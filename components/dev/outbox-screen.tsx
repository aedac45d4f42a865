import { View } from 'react-native';
import { Link, type Href } from 'expo-router';
import { useDevOutbox } from '@/hooks/use-dev-outbox';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { splitLinks } from '@/lib/linkify';
import { shortDate } from '@/lib/format';
import type { OutboxMessage } from '@/shared/schemas/outbox';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { AppText, Heading } from '@/components/ui/text';
import { Loading, LoadError } from '@/components/ui/load-state';
import { TextLink } from '@/components/ui/text-link';

/** Developer page: the e-mails the server captured instead of sending (reset links, invites). */
export function OutboxScreen() {
  const outbox = useDevOutbox();
  const messages = outbox.data; // newest first, as the server sends them
  return (
    <Screen testID="screen-dev-outbox" title="Developer: captured e-mails">
      <Banner
        tone="watch"
        title="Developer page"
        message="E-mails the development server captured instead of sending. Keepers never see this page, and it does not exist on a live server."
        testID="dev-outbox-notice"
      />
      <Heading>Captured e-mails</Heading>
      <TextLink href="/sign-in" label="Go to sign in" testID="dev-outbox-sign-in" />
      {outbox.isPending ? <Loading label="Loading captured e-mails…" /> : null}
      {outbox.isError && isApiRequestError(outbox.error) && outbox.error.status === 404 ? (
        <Banner tone="info" title="No outbox here" message="This server does not capture e-mail (it is not running in development mode)." testID="dev-outbox-off" />
      ) : outbox.isError ? (
        <LoadError title="Could not load the outbox" error={outbox.error} onRetry={() => void outbox.refetch()} retrying={outbox.isFetching} />
      ) : null}
      {messages && messages.length === 0 ? (
        <AppText tone="textMuted" testID="dev-outbox-empty">
          Nothing captured yet. Ask for a password reset and the e-mail will appear here within a few seconds.
        </AppText>
      ) : null}
      {messages?.map((m) => <OutboxItem key={String(m.id)} message={m} />)}
    </Screen>
  );
}

function OutboxItem({ message }: { message: OutboxMessage }) {
  const { colors, font, space } = useTheme();
  return (
    <Card testID={`dev-mail-${message.id}`} style={{ gap: space.sm }}>
      <AppText variant="title" weight="bold">
        {message.subject || '(no subject)'}
      </AppText>
      <AppText variant="caption" tone="textMuted">
        {`To ${message.to.join(', ')} · from ${message.from} · ${shortDate(message.date)} ${new Date(message.date).toLocaleTimeString()}`}
      </AppText>
      <View style={{ borderTopWidth: 1, borderTopColor: colors.border, paddingTop: space.sm }}>
        <AppText selectable>
          {splitLinks(message.text).map((part, i) =>
            part.kind === 'link' ? (
              <Link
                key={i}
                href={part.url as Href}
                accessibilityRole="link"
                accessibilityLabel={`Open link ${part.url}`}
                style={[font.bold, { color: colors.link, textDecorationLine: 'underline' }]}
              >
                {part.text}
              </Link>
            ) : (
              part.text
            ),
          )}
        </AppText>
      </View>
    </Card>
  );
}
