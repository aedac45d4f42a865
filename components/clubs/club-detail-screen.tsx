import { View } from 'react-native';
import { router } from 'expo-router';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createInviteSchema, clubShareSchema, type ClubDetail, type PendingInvite } from '@/shared/schemas/club';
import { useClub, useClubShares, useInvite, useLeaveClub, usePendingInvites, useRemoveMember, useRevokeInvite, useSetRole } from '@/hooks/use-clubs';
import { useTankList } from '@/hooks/use-tanks';
import { useFormState } from '@/hooks/use-form-state';
import { useTheme } from '@/hooks/use-theme';
import { apiRequest, isApiRequestError } from '@/lib/api-client';
import { clubKeys } from '@/lib/query-keys';
import { formErrorsFromRequest, NO_FORM_ERRORS, validateForm } from '@/lib/form-errors';
import { relativeDayLabel, shortDate } from '@/lib/format';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Banner } from '@/components/ui/banner';
import { StatusPill } from '@/components/ui/status-pill';
import { TextField } from '@/components/ui/text-field';
import { TextLink } from '@/components/ui/text-link';
import { AppText, Heading } from '@/components/ui/text';
import { Loading, LoadError } from '@/components/ui/load-state';
import { ROLE_LABEL } from './role-labels';

/** A club: members and roles, invites (organizers), shared items, and leaving. */
export function ClubDetailScreen({ id }: { id: string }) {
  const club = useClub(id);
  return (
    <Screen testID="screen-club" title={club.data?.name ?? 'Club'}>
      <TextLink href="/clubs" label="← All clubs" testID="club-back" />
      {club.isPending ? <Loading label="Loading the club…" /> : null}
      {club.isError && isApiRequestError(club.error) && club.error.status === 404 ? (
        <Banner tone="watch" title="Club not found" message="This club does not exist, or you are not a member." testID="club-not-found" />
      ) : club.isError ? (
        <LoadError title="Could not load this club" error={club.error} onRetry={() => void club.refetch()} retrying={club.isFetching} />
      ) : null}
      {club.data ? <ClubBody club={club.data} /> : null}
    </Screen>
  );
}

function ClubBody({ club }: { club: ClubDetail }) {
  const { space } = useTheme();
  const organizer = club.myRole === 'organizer';
  const setRole = useSetRole(club.id);
  const remove = useRemoveMember(club.id);
  const leave = useLeaveClub(club.id);
  return (
    <>
      <View style={{ gap: space.xs }}>
        <Heading testID="club-name">{club.name}</Heading>
        <AppText tone="textMuted">{`You are ${ROLE_LABEL[club.myRole].toLowerCase()} here.`}</AppText>
        <TextLink href="/lessons" label="Lessons →" testID="club-lessons" />
        {club.myRole !== 'member' ? <TextLink href={`/lessons/new?club=${club.id}`} label="+ New lesson for this club" testID="club-new-lesson" /> : null}
      </View>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.lg }}>
        <View style={{ flexGrow: 1, flexBasis: 320, gap: space.lg }}>
          <Card testID="club-members" style={{ gap: space.md }}>
            <Heading level={2}>Members</Heading>
            {setRole.error || remove.error ? <Banner tone="danger" title="That did not work" message={(setRole.error ?? remove.error)!.message} /> : null}
            {club.members.map((m) => (
              <View key={m.userId} style={{ gap: space.xs }} testID={`club-member-${m.userId}`}>
                <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' }}>
                  <AppText weight="bold">{m.displayName}</AppText>
                  <StatusPill tone={m.role === 'member' ? 'info' : 'ok'} label={ROLE_LABEL[m.role]} />
                </View>
                {organizer && m.role !== 'organizer' ? (
                  <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
                    <Button
                      variant="secondary"
                      label={m.role === 'mentor' ? 'Remove mentor role' : 'Make mentor'}
                      accessibilityLabel={`${m.role === 'mentor' ? 'Remove the mentor role of' : 'Make a mentor of'} ${m.displayName}`}
                      onPress={() => setRole.mutate({ userId: m.userId, role: m.role === 'mentor' ? 'member' : 'mentor' })}
                      testID="club-member-role"
                    />
                    <Button variant="quiet" label="Remove" accessibilityLabel={`Remove ${m.displayName} from the club`} onPress={() => remove.mutate(m.userId)} testID="club-member-remove" />
                  </View>
                ) : null}
              </View>
            ))}
          </Card>
          {organizer ? <InviteCard clubId={club.id} /> : null}
        </View>
        <View style={{ flexGrow: 1, flexBasis: 320, gap: space.lg }}>
          <SharesCard club={club} />
          <Card style={{ gap: space.sm }}>
            {leave.error ? <Banner tone="watch" title="You are still in the club" message={leave.error.message} testID="club-leave-error" /> : null}
            <Button variant="secondary" label="Leave club" onPress={() => leave.mutate(undefined, { onSuccess: () => router.replace('/clubs') })} testID="club-leave" />
          </Card>
        </View>
      </View>
    </>
  );
}

function InviteCard({ clubId }: { clubId: string }) {
  const { space } = useTheme();
  const invite = useInvite(clubId);
  const { values, setValue, errors, setErrors } = useFormState({ email: '' });
  const submit = () => {
    const checked = validateForm(createInviteSchema, values);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors(NO_FORM_ERRORS);
    invite.mutate(checked.data.email, { onSuccess: () => setValue('email')(''), onError: (e) => setErrors(formErrorsFromRequest(e, ['email'])) });
  };
  return (
    <Card testID="club-invite" style={{ gap: space.md }}>
      <Heading level={2}>Invite by e-mail</Heading>
      <AppText tone="textMuted">The link works once and for 7 days. New people join as members.</AppText>
      {invite.data ? <Banner tone="ok" title={`Invite sent to ${invite.data.email}`} testID="club-invite-sent" /> : null}
      {errors.banner ? <Banner tone="danger" title="No invite was sent" message={errors.banner} /> : null}
      <TextField
        label="E-mail"
        testID="club-invite-email"
        value={values.email}
        onChangeText={setValue('email')}
        error={errors.fields.email}
        inputMode="email"
        autoCapitalize="none"
        autoCorrect={false}
        onSubmitEditing={submit}
      />
      <Button label="Send invite" onPress={submit} busy={invite.isPending} testID="club-invite-submit" />
      <PendingInvites clubId={clubId} onRevoked={(email) => invite.data?.email === email && invite.reset()} />
    </Card>
  );
}

/** Invites sent but not answered yet, each with a way to take it back before it is used. */
function PendingInvites({ clubId, onRevoked }: { clubId: string; onRevoked: (email: string) => void }) {
  const { space, colors } = useTheme();
  const pending = usePendingInvites(clubId, true);
  const revoke = useRevokeInvite(clubId);
  const now = new Date();
  const take = (i: PendingInvite) => revoke.mutate(i.id, { onSuccess: () => onRevoked(i.email) });
  return (
    <View testID="club-pending-invites" style={{ gap: space.sm, borderTopWidth: 1, borderTopColor: colors.border, paddingTop: space.md }}>
      <Heading level={3}>Not answered yet</Heading>
      {pending.isError ? (
        <LoadError title="Could not load the open invites" error={pending.error} onRetry={() => void pending.refetch()} retrying={pending.isFetching} />
      ) : null}
      {revoke.error ? <Banner tone="watch" title="Not revoked" message={revoke.error.message} testID="club-invite-revoke-error" /> : null}
      {pending.data?.invites.length === 0 ? <AppText tone="textMuted">No open invites.</AppText> : null}
      {pending.data?.invites.map((i) => (
        <View key={i.id} testID="club-pending-invite" style={{ flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'space-between', gap: space.sm }}>
          <View style={{ flexShrink: 1, flexGrow: 1, flexBasis: 180, gap: space.xxs }}>
            <AppText weight="bold" testID="club-pending-invite-email">{i.email}</AppText>
            <AppText variant="caption" tone="textMuted">{`Link works until ${shortDate(i.expiresAt)} (${relativeDayLabel(i.expiresAt, now)}) · sent by ${i.invitedBy}`}</AppText>
          </View>
          <Button
            variant="secondary"
            label="Revoke"
            accessibilityLabel={`Revoke the invite to ${i.email}`}
            busy={revoke.isPending && revoke.variables === i.id}
            busyLabel="Revoking…"
            onPress={() => take(i)}
            testID="club-pending-invite-revoke"
          />
        </View>
      ))}
    </View>
  );
}

function SharesCard({ club }: { club: ClubDetail }) {
  const { space } = useTheme();
  const shares = useClubShares(club.id);
  const tanks = useTankList();
  const qc = useQueryClient();
  const share = useMutation({
    mutationFn: (item: { itemType: 'tank' | 'plan'; itemId: string }) =>
      apiRequest(`/api/clubs/${encodeURIComponent(club.id)}/shares`, { method: 'POST', body: item, schema: clubShareSchema }),
    onSuccess: () => qc.invalidateQueries({ queryKey: clubKeys.shares(club.id) }),
  });
  const sharedIds = new Set(shares.data?.shares.filter((s) => s.mine).map((s) => s.title));
  const seesAll = club.myRole !== 'member';
  return (
    <Card testID="club-shares" style={{ gap: space.md }}>
      <Heading level={2}>Shared with the club</Heading>
      <AppText tone="textMuted">
        {seesAll ? 'Tanks and plans members shared for advice.' : 'Your tanks and plans that the club’s mentors and organizers can see.'}
      </AppText>
      {shares.data?.shares.length === 0 ? <AppText>Nothing shared yet.</AppText> : null}
      {shares.data?.shares.map((s) => (
        <View key={s.id} style={{ gap: space.xxs }}>
          <TextLink href={`/clubs/${club.id}/shares/${s.id}`} label={`${s.itemType === 'plan' ? 'Plan' : 'Tank'}: ${s.title}`} testID="club-share-link" />
          <AppText variant="caption" tone="textMuted">{`${s.mine ? 'Yours' : s.ownerName} · ${s.commentCount} comment${s.commentCount === 1 ? '' : 's'}`}</AppText>
        </View>
      ))}
      {share.error ? <Banner tone="danger" title="Not shared" message={share.error.message} /> : null}
      {tanks.data && tanks.data.tanks.length > 0 ? (
        <View style={{ gap: space.sm }}>
          <AppText weight="bold">Share one of yours</AppText>
          {tanks.data.tanks.map((t) => (
            <View key={t.id} style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
              {!sharedIds.has(t.name) ? (
                <Button variant="secondary" label={`Tank: ${t.name}`} accessibilityLabel={`Share the tank ${t.name}`} onPress={() => share.mutate({ itemType: 'tank', itemId: t.id })} testID="club-share-tank" />
              ) : null}
              {t.activePlan && !sharedIds.has(t.activePlan.name) ? (
                <Button
                  variant="secondary"
                  label={`Plan: ${t.activePlan.name}`}
                  accessibilityLabel={`Share the plan ${t.activePlan.name}`}
                  onPress={() => share.mutate({ itemType: 'plan', itemId: t.activePlan!.id })}
                  testID="club-share-plan"
                />
              ) : null}
            </View>
          ))}
        </View>
      ) : null}
    </Card>
  );
}
