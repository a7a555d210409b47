import { useId, useMemo, useState } from 'react';
import { lengthUnitOf, type LengthRounding } from '../../geometry/units';
import { useShopRounding } from '../settings/queries';
import { Pressable, StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useSchemaForm } from '../ui/useSchemaForm';
import { pieceForm } from './pieceForm';
import { sideInputText } from './pieceSize';
import { useCreatePiece, useUpdatePiece } from './queries';
import { pieceKindLabels, pieceKinds, type Piece, type PieceKind } from './schema';

interface Props {
  jobId: string;
  /** The piece to change; a new piece when absent. */
  piece?: Piece;
  onDone: () => void;
}

interface FormValues {
  kind: PieceKind | '';
  label: string;
  widthIn: string;
  heightIn: string;
  notes: string;
}

function startingValues(rounding: LengthRounding, piece?: Piece): FormValues {
  if (!piece) return { kind: '', label: '', widthIn: '', heightIn: '', notes: '' };
  const side = (v: number) => sideInputText(v, rounding);
  return { kind: piece.kind, label: piece.label, widthIn: side(piece.widthIn), heightIn: side(piece.heightIn), notes: piece.notes ?? '' };
}

/** Add or change a piece; sizes are typed the way a framer measures: `8 1/2`, `3-1/4"` or `216mm`. */
export function PieceForm({ jobId, piece, onDone }: Props) {
  const create = useCreatePiece(jobId);
  const update = useUpdatePiece(jobId);
  const saving = piece ? update : create;
  const rounding = useShopRounding();
  const unit = lengthUnitOf(rounding);
  const schema = useMemo(() => pieceForm(unit), [unit]);
  const { values, set, fields, hasFieldErrors, submit: check } = useSchemaForm(schema, startingValues(rounding, piece));
  const submit = () =>
    check((input, onError) => {
      const handlers = { onSuccess: onDone, onError };
      if (piece) update.mutate({ pieceId: piece.id, changes: input }, handlers);
      else create.mutate(input, handlers);
    });

  const failedWithoutFields = saving.isError && !hasFieldErrors;
  return (
    <View style={styles.form} testID="piece-form">
      <Text variant="heading">{piece ? `Change ${piece.label}` : 'Add a piece'}</Text>
      {failedWithoutFields ? <Notice>{errorMessage(saving.error) ?? ''}</Notice> : null}
      <KindPicker value={values.kind} onChange={set('kind')} error={fields.kind} />
      <TextField label="Name" testID="piece-label" placeholder="Home jersey, team photo, name plaque" value={values.label} onChangeText={set('label')} error={fields.label} />
      <View style={styles.sizes}>
        <View style={styles.side}>
          <TextField label="Width" testID="piece-width" placeholder={unit === 'mm' ? '216' : '8 1/2'} value={values.widthIn} onChangeText={set('widthIn')} error={fields.widthIn} hint={unit === 'mm' ? 'Millimetres unless you add in or cm' : 'Inches unless you add mm or cm'} />
        </View>
        <View style={styles.side}>
          <TextField label="Height" testID="piece-height" placeholder={unit === 'mm' ? '279' : '11'} value={values.heightIn} onChangeText={set('heightIn')} error={fields.heightIn} />
        </View>
      </View>
      <TextField label="Notes" testID="piece-notes" value={values.notes} onChangeText={set('notes')} multiline error={fields.notes} />
      <View style={styles.actions}>
        <Button label="Cancel" kind="quiet" onPress={onDone} />
        <Button label={piece ? 'Save changes' : 'Add piece'} onPress={submit} busy={saving.isPending} testID="save-piece" />
      </View>
    </View>
  );
}

function KindPicker({ value, onChange, error }: { value: string; onChange: (kind: string) => void; error?: string }) {
  const errorId = `${useId()}-error`;
  return (
    <View style={styles.kindBox}>
      <Text variant="label">Kind</Text>
      <View style={styles.kinds} role="radiogroup" aria-label="Kind" aria-invalid={error ? true : undefined} aria-describedby={error ? errorId : undefined}>
        {pieceKinds.map((kind) => {
          const selected = kind === value;
          return (
            <Pressable
              key={kind}
              role="radio"
              aria-checked={selected}
              onPress={() => onChange(kind)}
              style={[styles.kind, selected && styles.kindSelected]}
              testID={`piece-kind-${kind}`}
            >
              <Text variant="label" style={selected ? styles.kindSelectedText : undefined}>
                {pieceKindLabels[kind]}
              </Text>
            </Pressable>
          );
        })}
      </View>
      {error ? (
        <Text variant="caption" style={styles.error} role="alert" nativeID={errorId}>
          {error}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md, padding: space.lg, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.paper },
  sizes: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  side: { flexGrow: 1, flexBasis: 140 },
  actions: { flexDirection: 'row', justifyContent: 'flex-end', gap: space.sm },
  kindBox: { gap: space.xs },
  kinds: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  kind: { minHeight: 40, justifyContent: 'center', borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, paddingHorizontal: space.md, backgroundColor: colors.card },
  kindSelected: { backgroundColor: colors.accent, borderColor: colors.accent },
  kindSelectedText: { color: colors.accentInk },
  error: { color: colors.danger },
});
