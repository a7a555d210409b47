import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { MemberRole } from '../auth/schema';
import { EmailField } from '../ui/AccountFields';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useSchemaForm } from '../ui/useSchemaForm';
import { useInvite } from './queries';
import { RolePicker } from './RolePicker';
import { inviteInput } from './schema';

/** Owner only: e-mail someone a link to join the shop with a role. */
export function InviteForm() {
  const invite = useInvite();
  const { values, setValues, set, fields, submit: check } = useSchemaForm(inviteInput, { email: '', role: 'designer' as MemberRole });
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { email, role } = values;
  const setEmail = set('email');
  const setRole = (next: MemberRole) => setValues((v) => ({ ...v, role: next }));

  const submit = () => {
    setSentTo(null);
    check((input, onError) =>
      invite.mutate(input, {
        onSuccess: () => {
          setSentTo(input.email);
          setValues((v) => ({ ...v, email: '' }));
        },
        onError,
      }),
    );
  };

  return (
    <View style={styles.card}>
      <Text variant="heading">Invite someone</Text>
      <Text variant="caption">They get an e-mail with a link that works once, for 7 days, to choose their name and password.</Text>
      {invite.isError && !fields.email ? <Notice title="The invitation was not sent">{errorMessage(invite.error) ?? ''}</Notice> : null}
      {sentTo ? <Notice tone="info">{`Invitation sent to ${sentTo}.`}</Notice> : null}
      <EmailField
        testID="invite-email"
        value={email}
        onChangeText={setEmail}
        onSubmitEditing={submit}
        error={fields.email}
      />
      <View style={styles.field}>
        <Text variant="label">Role</Text>
        <RoleChoice role={role} onChange={setRole} />
        {fields.role ? (
          <Text variant="caption" style={styles.error}>
            {fields.role}
          </Text>
        ) : null}
      </View>
      <Button label="Send invitation" onPress={submit} busy={invite.isPending} testID="send-invitation" />
    </View>
  );
}

const roleHints: Record<MemberRole, string> = {
  owner: 'Everything, including settings and the team.',
  designer: 'Customers, jobs, pieces and photos, layouts and cut files.',
  front_desk: 'Customers, jobs, pieces and photos; reads layouts without changing them.',
};

function RoleChoice({ role, onChange }: { role: MemberRole; onChange: (r: MemberRole) => void }) {
  return (
    <>
      <RolePicker value={role} onChange={onChange} label="Role for the person invited" testID="invite-role" />
      <Text variant="caption">{roleHints[role]}</Text>
    </>
  );
}

const styles = StyleSheet.create({
  card: { backgroundColor: colors.card, borderRadius: radius.lg, padding: space.lg, gap: space.md, borderWidth: 1, borderColor: colors.line },
  field: { gap: space.xs },
  error: { color: colors.danger },
});
