import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { roleLabels, type MemberRole } from '../auth/schema';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useChangeRole, useRemoveMember } from './queries';
import { RolePicker } from './RolePicker';
import type { TeamMember } from './schema';

interface Props {
  member: TeamMember;
  isYou: boolean;
  /** Owners see role choices and a remove button; everyone else reads. */
  canManage: boolean;
  /** Called after you removed yourself, since your session ended with it. */
  onRemovedSelf: () => void;
}

export function TeamRow({ member, isYou, canManage, onRemovedSelf }: Props) {
  const changeRole = useChangeRole();
  const remove = useRemoveMember();
  const [confirming, setConfirming] = useState(false);
  const failure = changeRole.error ?? remove.error;
  const slug = member.email.replace(/[^a-z0-9]+/g, '-');

  const setRole = (role: MemberRole) => {
    if (role !== member.role) changeRole.mutate({ id: member.id, role });
  };
  const confirmRemove = () =>
    remove.mutate(member.id, {
      onSuccess: () => (isYou ? onRemovedSelf() : undefined),
      onSettled: () => setConfirming(false),
    });

  return (
    <View style={styles.row} role="listitem" testID={`member-${slug}`}>
      <View style={styles.who}>
        <Text variant="heading" numberOfLines={1}>
          {member.name}
          {isYou ? <Text variant="caption"> (you)</Text> : null}
        </Text>
        <Text variant="caption" numberOfLines={1}>
          {member.email}
        </Text>
      </View>
      <View style={styles.controls}>
        {canManage ? (
          <RolePicker value={member.role} onChange={setRole} label={`Role for ${member.name}`} disabled={changeRole.isPending} testID={`role-${slug}`} />
        ) : (
          <Text variant="label">{roleLabels[member.role]}</Text>
        )}
        {canManage && !confirming ? <Button label="Remove" kind="quiet" onPress={() => setConfirming(true)} testID={`remove-${slug}`} /> : null}
      </View>
      {failure ? <Notice>{errorMessage(failure) ?? ''}</Notice> : null}
      {canManage && confirming ? (
        <View style={styles.confirm}>
          <Text style={styles.grow}>{isYou ? 'Remove yourself? You will be signed out.' : `Remove ${member.name}? They are signed out at once.`}</Text>
          <Button label="Keep" kind="secondary" onPress={() => setConfirming(false)} />
          <Button label="Remove" onPress={confirmRemove} busy={remove.isPending} testID={`confirm-remove-${slug}`} />
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { backgroundColor: colors.card, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, padding: space.lg, gap: space.sm },
  who: { minWidth: 0 },
  controls: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  confirm: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  grow: { flexGrow: 1, flexBasis: 200 },
});
