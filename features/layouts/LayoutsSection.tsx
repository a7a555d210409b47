import { useQuery } from '@tanstack/react-query';
import { Link, useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { authQueries } from '../auth/queries';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { layoutQueries, useCreateLayout } from './queries';
import { dayText } from '../ui/dates';

/** The job's mat layouts, newest change first, each opening in the designer; designers start new ones here. */
export function LayoutsSection({ jobId }: { jobId: string }) {
  const layouts = useQuery(layoutQueries.job(jobId));
  const me = useQuery(authQueries.me());
  const create = useCreateLayout(jobId);
  const router = useRouter();
  const [name, setName] = useState('');
  const canCreate = me.data?.member.role !== 'front_desk';

  const start = () =>
    create.mutate(name.trim() || 'Layout', {
      onSuccess: (created) => {
        setName('');
        router.push({ pathname: '/layouts/[id]', params: { id: created.layout.id } });
      },
    });

  return (
    <View style={styles.card} testID="layouts-section">
      <Text variant="heading">Layouts</Text>
      {layouts.isError ? <Notice title="The layouts could not be loaded">{layouts.error.message}</Notice> : null}
      {layouts.data?.layouts.length === 0 ? <Text variant="caption">No layouts yet.</Text> : null}
      {layouts.data?.layouts.map((l) => (
        <Link key={l.id} href={{ pathname: '/layouts/[id]', params: { id: l.id } }} style={styles.row} testID={`layout-link-${l.id}`}>
          <Text variant="label">{l.name}</Text>
          <Text variant="caption">
            {' '}· {l.versionCount === 0 ? 'no versions frozen' : `${l.versionCount} version${l.versionCount === 1 ? '' : 's'} frozen`} · changed{' '}
            {dayText(l.updatedAt)}
          </Text>
        </Link>
      ))}
      {canCreate ? (
        <View style={styles.create}>
          <TextField label="New layout name" value={name} onChangeText={setName} placeholder="Jersey with two patches" testID="new-layout-name" maxLength={120} />
          <Button label="New layout" onPress={start} busy={create.isPending} testID="new-layout" />
          {create.isError ? <Notice>{create.error.message}</Notice> : null}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.sm, backgroundColor: colors.card, padding: space.lg, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line },
  row: { paddingVertical: space.sm, borderTopWidth: 1, borderTopColor: colors.line },
  create: { gap: space.sm, marginTop: space.sm },
});
