import { useQuery } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { glazingKindLabels, isGlass, type FrameChoice, type GlazingKind } from '../settings/materials';
import { settingsQueries, useShopRounding } from '../settings/queries';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { LengthField } from '../ui/LengthField';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { errorMessage, serverFieldErrors } from '../ui/useFieldErrors';
import { useUpdateJob } from './queries';
import type { Job } from './schema';

/** The frame the job will be built in: moulding, glazing and shadowbox depth, read by the quote and the shipping box. */
export function FramePanel({ job }: { job: Job }) {
  const settings = useQuery(settingsQueries.shop());
  const rounding = useShopRounding();
  const update = useUpdateJob(job.id);
  const mouldings = settings.data?.settings.mouldings ?? [];
  const glazing = settings.data?.settings.glazing ?? [];
  const [draft, setDraft] = useState<FrameChoice | null>(job.frame);
  const [errors, setErrors] = useState<Record<string, string>>({});
  useEffect(() => setDraft(job.frame), [job.frame]);
  if (!settings.data) return null;
  if (mouldings.length === 0 || glazing.length === 0) {
    return (
      <View style={styles.card} testID="frame-panel">
        <Text variant="heading">Frame</Text>
        <Text variant="caption">The shop lists no {mouldings.length === 0 ? 'mouldings' : 'glazing'} yet; the owner adds them under Settings.</Text>
      </View>
    );
  }
  const value: FrameChoice = draft ?? { mouldingCode: mouldings[0]!.code, glazingKind: glazing[0]!.kind, shadowboxDepthIn: 0 };
  const set = (patch: Partial<FrameChoice>) => setDraft({ ...value, ...patch });
  const changed = JSON.stringify(value) !== JSON.stringify(job.frame);
  const save = () => update.mutate({ frame: value }, { onSuccess: () => setErrors({}), onError: (e) => setErrors(serverFieldErrors(e)) });
  return (
    <View style={styles.card} testID="frame-panel">
      <Text variant="heading">Frame</Text>
      {!job.frame ? <Text variant="caption">No frame chosen yet: a quote now prices the mats and work only.</Text> : null}
      <ChoiceChips label="Moulding" options={mouldings.map((m) => ({ value: m.code, label: `${m.code} · ${m.name}` }))} value={value.mouldingCode} onChange={(mouldingCode) => set({ mouldingCode })} testID="frame-moulding" />
      <ChoiceChips<GlazingKind> label="Glazing" options={glazing.map((g) => ({ value: g.kind, label: glazingKindLabels[g.kind] }))} value={value.glazingKind} onChange={(glazingKind) => set({ glazingKind })} testID="frame-glazing" />
      {isGlass(value.glazingKind) ? (
        <Notice tone="info" title="Glass">
          A frame that will be shipped is safer in acrylic: it is lighter and does not shatter in the box. Handle glass with gloves and eye protection and carry sheets on edge.
        </Notice>
      ) : null}
      <LengthField label="Shadowbox depth (0 for a flat frame)" value={value.shadowboxDepthIn} rounding={rounding} onChange={(shadowboxDepthIn) => set({ shadowboxDepthIn })} error={errors['frame.shadowboxDepthIn']} testID="frame-depth" />
      {update.isError && Object.keys(errors).length === 0 ? <Notice>{errorMessage(update.error) ?? ''}</Notice> : null}
      {changed ? <Button label="Save the frame" onPress={save} busy={update.isPending} testID="frame-save" /> : <Text variant="caption" testID="frame-saved">{job.frame ? 'Saved on the job.' : ''}</Text>}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.sm, backgroundColor: colors.card, padding: space.lg, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line },
});
