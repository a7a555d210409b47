import { useQuery } from '@tanstack/react-query';
import { memo, useState, type Dispatch } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Finding, Layout } from '../../geometry';
import { parseLayout } from '../../geometry/layout';
import { ApiError } from '../api/client';
import { BlockingFindings } from '../exports/BlockingFindings';
import { CutFilesPanel } from '../exports/CutFilesPanel';
import { blockingFindingsOf, type BlockingFinding } from '../exports/schema';
import type { LayoutDetail } from '../layouts/schema';
import { layoutQueries, useFreezeVersion } from '../layouts/queries';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, space } from '../ui/theme';
import type { EditorAction } from './editorState';
import { MatPreview } from './MatPreview';
import { momentText } from '../ui/dates';

interface Props {
  layoutId: string;
  jobId: string;
  versions: LayoutDetail['versions'];
  editable: boolean;
  dispatch: Dispatch<EditorAction>;
  /** Saves the draft now; null when it could not be saved. */
  flush: () => Promise<number | null>;
  onConflict: () => void;
  /** The designer's own checks of the draft; errors are shown beside the freeze button. */
  findings: readonly Finding[];
}

/** Freezing the draft as a numbered version that never changes again, and looking back at earlier ones. */
export const VersionsPanel = memo(function VersionsPanel({ layoutId, jobId, versions, editable, dispatch, flush, onConflict, findings }: Props) {
  const [note, setNote] = useState('');
  const [message, setMessage] = useState<string | null>(null);
  const [refused, setRefused] = useState<BlockingFinding[]>([]);
  const blocking = findings.filter((f) => f.severity === 'error');
  const [preview, setPreview] = useState<number | null>(null);
  const [cutFiles, setCutFiles] = useState<number | null>(null);
  const freeze = useFreezeVersion(layoutId, jobId);

  const freezeNow = async () => {
    setMessage(null);
    setRefused([]);
    const revision = await flush();
    if (revision === null) return setMessage('The draft could not be saved, so nothing was frozen. See the message above the canvas.');
    freeze.mutate(
      { baseRevision: revision, note: note.trim() || undefined },
      {
        onSuccess: ({ number }) => {
          setNote('');
          setMessage(`Version ${number} is frozen.`);
        },
        onError: (error) => {
          if (error instanceof ApiError && error.status === 409) return onConflict();
          const listed = error instanceof ApiError ? blockingFindingsOf(error.body) : [];
          if (listed.length > 0) return setRefused(listed);
          setMessage(error.message);
        },
      },
    );
  };

  return (
    <View style={styles.panel} testID="versions">
      {editable ? (
        <View style={styles.freeze}>
          <TextField label="Note for this version (optional)" value={note} onChangeText={setNote} maxLength={300} testID="version-note" />
          <Button label="Freeze version" onPress={() => void freezeNow()} busy={freeze.isPending} testID="freeze-version" />
          {refused.length > 0 ? (
            <BlockingFindings title="Not frozen: the board cannot be cut until these are fixed" findings={refused} testID="freeze-refused" />
          ) : (
            <BlockingFindings title="Fix these first: a version with them cannot be frozen" findings={blocking} testID="freeze-blockers" />
          )}
          <Text variant="caption">A frozen version never changes; The draft stays editable.</Text>
        </View>
      ) : null}
      {message ? <Notice tone="info">{message}</Notice> : null}
      {versions.length === 0 ? <Text variant="caption">No versions frozen yet.</Text> : null}
      {versions.map((v) => (
        <View key={v.number} style={styles.version} testID={`version-${v.number}`}>
          <Text variant="label">Version {v.number}</Text>
          <Text variant="caption">
            {momentText(v.frozenAt)}{v.frozenByName ? ` · ${v.frozenByName}` : ''}{v.note ? ` · ${v.note}` : ''}
          </Text>
          <Button kind="quiet" label={preview === v.number ? 'Close preview' : 'Preview'} onPress={() => setPreview(preview === v.number ? null : v.number)}
            testID={`version-preview-${v.number}`} />
          {preview === v.number ? <VersionPreview layoutId={layoutId} number={v.number} editable={editable} onUse={(layout) => dispatch({ type: 'replace', layout })} /> : null}
          {editable ? (
            <Button kind="quiet" label={cutFiles === v.number ? 'Hide cut files' : 'Cut files'} onPress={() => setCutFiles(cutFiles === v.number ? null : v.number)}
              testID={`version-cut-files-${v.number}`} />
          ) : null}
          {editable && cutFiles === v.number ? <CutFilesPanel layoutId={layoutId} versionNumber={v.number} /> : null}
        </View>
      ))}
    </View>
  );
});

function VersionPreview({ layoutId, number, editable, onUse }: { layoutId: string; number: number; editable: boolean; onUse: (layout: Layout) => void }) {
  const version = useQuery(layoutQueries.version(layoutId, number));
  if (version.isPending) return <Text variant="caption">Loading version {number}…</Text>;
  if (version.isError) return <Notice>{version.error.message}</Notice>;
  const parsed = parseLayout(version.data.version.document);
  if (!parsed.ok) return <Notice>{`Version ${number} cannot be shown: ${parsed.issues[0]?.message ?? 'it is not a readable layout'}`}</Notice>;
  return (
    <View style={styles.preview}>
      <MatPreview layout={parsed.layout} testID={`version-picture-${number}`} />
      {editable ? <Button kind="secondary" label="Copy into the draft (Undo brings the draft back)" onPress={() => onUse(parsed.layout)} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: space.md },
  freeze: { gap: space.sm },
  version: { gap: space.xs, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.sm },
  preview: { gap: space.sm },
});
