import { View } from 'react-native';
import { SHARE_LINK_CHOICES, SHARE_LINK_DEFAULT_DAYS, type ShareableType } from '@/shared/schemas/share';
import { useCreateShareLink, useRevokeShareLink, useShareLinks } from '@/hooks/use-lessons';
import { useTheme } from '@/hooks/use-theme';
import { shortDate } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { AppText, Heading } from '@/components/ui/text';

const lifetime = (days: number) => (days === 365 ? '1-year' : `${days}-day`);

/**
 * Read-only links to a plan or lesson for people without an account. The full address is shown
 * once, right after it is made (only its hash is kept); older links can only be revoked. Every
 * link expires: 30 days unless the keeper picks another lifetime. A lesson's organizers see
 * and may revoke the links other managers made.
 */
export function ShareLinkPanel({ itemType, itemId }: { itemType: ShareableType; itemId: string }) {
  const { space } = useTheme();
  const links = useShareLinks(itemType, itemId);
  const create = useCreateShareLink(itemType, itemId);
  const revoke = useRevokeShareLink(itemType, itemId);
  const live = links.data?.links.filter((l) => !l.revokedAt && Date.parse(l.expiresAt) > Date.now()) ?? [];
  const choices = [SHARE_LINK_DEFAULT_DAYS, ...SHARE_LINK_CHOICES.filter((d) => d !== SHARE_LINK_DEFAULT_DAYS)];
  return (
    <Card testID="share-links" style={{ gap: space.md }}>
      <Heading level={2}>Read-only link</Heading>
      <AppText tone="textMuted">
        Anyone with the link can view this {itemType} without an account. Nothing else of yours is shown. A link stops working on the day
        it expires, when it is revoked, or if you can no longer share this {itemType}.
      </AppText>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
        {choices.map((days) => (
          <Button
            key={days}
            variant={days === SHARE_LINK_DEFAULT_DAYS ? 'primary' : 'secondary'}
            label={`Make a ${lifetime(days)} link`}
            onPress={() => create.mutate(days)}
            busy={create.isPending}
            testID={days === SHARE_LINK_DEFAULT_DAYS ? 'share-create' : `share-create-${days}`}
          />
        ))}
      </View>
      {create.data ? (
        <Banner tone="ok" title="Link made — copy it now" testID="share-created">
          <AppText selectable testID="share-url">{create.data.url}</AppText>
        </Banner>
      ) : null}
      {create.error ? <Banner tone="danger" title="No link was made" message={create.error.message} /> : null}
      {live.map((l) => (
        <View key={l.id} style={{ flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' }}>
          <AppText testID="share-link-line">{`Made ${shortDate(l.createdAt)}${l.mine ? '' : ` by ${l.madeBy}`}, works until ${shortDate(l.expiresAt)}`}</AppText>
          <Button
            variant="quiet"
            label="Revoke"
            accessibilityLabel={`Revoke the link made ${shortDate(l.createdAt)}${l.mine ? '' : ` by ${l.madeBy}`}`}
            onPress={() => revoke.mutate(l.id)}
            testID="share-revoke"
          />
        </View>
      ))}
    </Card>
  );
}
