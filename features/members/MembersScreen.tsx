import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'expo-router';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { authQueries } from '../auth/queries';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';
import { InviteForm } from './InviteForm';
import { PendingInvitations } from './PendingInvitations';
import { memberQueries } from './queries';
import { TeamRow } from './TeamRow';

/** Who is on the team; owners also invite, change roles and remove people here. */
export function MembersScreen() {
  const me = useQuery(authQueries.me());
  const isOwner = me.data?.member.role === 'owner';
  const team = useQuery(memberQueries.team());
  const invitations = useQuery({ ...memberQueries.invitations(), enabled: isOwner });
  const client = useQueryClient();
  const router = useRouter();

  const signedOut = () => {
    client.clear();
    router.replace('/sign-in');
  };

  return (
    <Screen title="Team">
      <Text variant="title">Team</Text>
      {!isOwner && me.data ? <Text variant="caption">Only an owner can invite people or change the team.</Text> : null}
      {isOwner ? <InviteForm /> : null}
      {isOwner && invitations.data ? <PendingInvitations invitations={invitations.data.invitations} /> : null}
      {team.isPending ? <ActivityIndicator color={colors.accent} /> : null}
      {team.isError ? <Notice title="The team could not be loaded">{team.error.message}</Notice> : null}
      {team.data ? (
        <View style={styles.list}>
          <Text variant="heading">Members</Text>
          {isOwner ? <Text variant="caption">A shop always keeps at least one owner.</Text> : null}
          <View style={styles.list} role="list" aria-label="Members" testID="team-list">
            {team.data.members.map((m) => (
              <TeamRow key={m.id} member={m} isYou={m.id === me.data?.member.id} canManage={isOwner} onRemovedSelf={signedOut} />
            ))}
          </View>
        </View>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
});
