import { View } from 'react-native';
import type { ShareableType } from '@/shared/schemas/share';
import { useCreateShareLink, useRevokeShareLink, useShareLinks } from '@/hooks/use-lessons';
import { useTheme } from '@/hooks/use-theme';
import { shortDate } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { AppText, Heading } from '@/components/ui/text';

/**
 * Read-only links to a plan or lesson for people without an account. The full address is shown
 * once, right after it is made (only its hash is kept); older links can only be revoked.
 */
export function ShareLinkPanel({ itemType, itemId }: { itemType: ShareableType; itemId: string }) {
  const { space } = useTheme();
  const links = useShareLinks(itemType, itemId);
  const create = useCreateShareLink(itemType, itemId);
  const revoke = useRevokeShareLink(itemType, itemId);
  const live = links.data?.links.filter((l) => !l.revokedAt && (!l.expiresAt || Date.parse(l.expiresAt) > Date.now())) ?? [];
  return (
    <Card testID="share-links" style={{ gap: space.md }}>
      <Heading level={2}>Read-only link</Heading>
      <AppText tone="textMuted">Anyone with the link can view this {itemType} without an account. Nothing else of yours is shown.</AppText>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
        <Button label="Make a link" onPress={() => create.mutate(undefined)} busy={create.isPending} testID="share-create" />
        <Button variant="secondary" label="Make a 7-day link" onPress={() => create.mutate(7)} busy={create.isPending} testID="share-create-7" />
      </View>
      {create.data ? (
        <Banner tone="ok" title="Link made — copy it now" testID="share-created">
          <AppText selectable testID="share-url">{create.data.url}</AppText>
        </Banner>
      ) : null}
      {create.error ? <Banner tone="danger" title="No link was made" message={create.error.message} /> : null}
      {live.map((l) => (
        <View key={l.id} style={{ flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' }}>
          <AppText>{`Made ${shortDate(l.createdAt)}${l.expiresAt ? `, works until ${shortDate(l.expiresAt)}` : ', works until revoked'}`}</AppText>
          <Button variant="quiet" label="Revoke" accessibilityLabel={`Revoke the link made ${shortDate(l.createdAt)}`} onPress={() => revoke.mutate(l.id)} testID="share-revoke" />
        </View>
      ))}
    </Card>
  );
}
