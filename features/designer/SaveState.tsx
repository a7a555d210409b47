import { StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import type { SaveConflict, SaveStatus } from './useDraftAutosave';

const statusWords: Record<SaveStatus, string> = {
  saved: 'All changes saved',
  waiting: 'Changes not saved yet',
  saving: 'Saving…',
  failed: 'Not saved',
  conflict: 'Someone else saved',
};

/** The draft's save state in words, and the retry when a save failed. */
export function SaveStatusText({ status, editable, onRetry }: { status: SaveStatus; editable: boolean; onRetry: () => void }) {
  if (!editable) return <Text variant="caption">Read only</Text>;
  return (
    <View style={styles.status}>
      <Text variant="caption" testID="save-status" aria-live="polite">{statusWords[status]}</Text>
      {status === 'failed' ? <Button kind="quiet" label="Try again" onPress={onRetry} /> : null}
    </View>
  );
}

interface ConflictProps {
  conflict: SaveConflict;
  onLoadTheirs: () => void;
  onKeepMine: () => void;
}

/** Someone saved the draft first: nothing was overwritten, and the framer chooses what happens. */
export function ConflictNotice({ conflict, onLoadTheirs, onKeepMine }: ConflictProps) {
  const who = conflict.byName ?? 'Someone else';
  return (
    <View style={styles.conflict} role="alert" testID="save-conflict">
      <Text variant="label">{who} saved this layout after you opened it.</Text>
      <Text>
        Your latest changes are not saved. Load their version to carry on from it (Undo brings yours back), or keep yours and save it over theirs.
      </Text>
      <View style={styles.row}>
        <Button label="Load their version" onPress={onLoadTheirs} disabled={!conflict.theirs} testID="conflict-load-theirs" />
        <Button kind="secondary" label="Keep mine and save" onPress={onKeepMine} testID="conflict-keep-mine" />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  status: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  conflict: { backgroundColor: colors.warnSoft, borderColor: colors.warn, borderWidth: 1, borderRadius: radius.md, padding: space.md, gap: space.sm, margin: space.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
