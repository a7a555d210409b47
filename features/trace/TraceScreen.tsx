import { useQuery } from '@tanstack/react-query';
import { Link, useLocalSearchParams, useRouter } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { ApiError } from '../api/client';
import { PhotoUpload } from '../pieces/PhotoUpload';
import { photoUrl, pieceQueries } from '../pieces/queries';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { Image } from 'react-native';
import { CalibrationPanel } from './CalibrationPanel';
import { TraceEditor } from './TraceEditor';
import { TraceProgress } from './TraceProgress';
import { traceQueries, useStartTrace } from './queries';

const param = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

/**
 * Tracing a garment: pick or add its photo, mark the known rectangle, trace
 * on the server, correct the outline and keep it. The run's id stays in the
 * address, so a reload shows the same run where it has got to.
 */
export function TraceScreen() {
  const params = useLocalSearchParams<{ pieceId: string; job: string; trace?: string; photo?: string }>();
  const router = useRouter();
  const pieceId = param(params.pieceId) ?? '';
  const jobId = param(params.job) ?? '';
  const traceId = param(params.trace);
  const pieces = useQuery(pieceQueries.job(jobId));
  const piece = pieces.data?.pieces.find((p) => p.id === pieceId);
  const [photoId, setPhotoId] = useState<string | undefined>(param(params.photo));
  const run = useQuery({ ...traceQueries.run(traceId ?? ''), enabled: Boolean(traceId) });
  const start = useStartTrace(jobId, pieceId);

  if (pieces.isPending) return <Screen title="Trace a garment"><Text>Loading the garment…</Text></Screen>;
  if (!piece) return <Screen title="Garment not found"><Notice title="Not found">This garment is not on the job any more.</Notice></Screen>;
  const photo = piece.photos.find((p) => p.id === photoId) ?? piece.photos.at(-1);
  const trace = run.data?.trace;

  return (
    <Screen title={`Trace ${piece.label}`}>
      <Link href={`/jobs/${jobId}`}><Text variant="caption">Back to the job</Text></Link>
      <Text variant="title">Trace {piece.label}</Text>
      <Notice tone="info" title="For a true outline">Lay the folded garment flat on a plain board that contrasts with it and shoot straight down in even light. Keep a rectangle of known size in the same plane in view: the mounting board, a mat sheet, or a Letter or A4 sheet.</Notice>
      {piece.outline ? <Text variant="caption" testID="outline-kept">This garment has a saved outline; it stays until a new one is saved.</Text> : null}
      <Text variant="label">Photo</Text>
      <View style={styles.photos}>
        {piece.photos.map((p) => (
          <Pressable key={p.id} onPress={() => setPhotoId(p.id)} role="button" aria-label={`Use photo ${p.originalName ?? ''}`}
            style={[styles.thumb, p.id === photo?.id && styles.chosen]} testID={`trace-photo-${p.id}`}>
            <Image source={{ uri: photoUrl(p.id) }} style={styles.image} resizeMode="cover" />
          </Pressable>
        ))}
      </View>
      <PhotoUpload jobId={jobId} pieceId={pieceId} pieceLabel={piece.label} />
      {photo && !trace ? (
        <CalibrationPanel key={photo.id} photo={photo} busy={start.isPending}
          onTrace={(request) => start.mutate(request, { onSuccess: (r) => router.setParams({ trace: r.trace.id }) })} />
      ) : null}
      {start.isError ? <Text style={styles.problem} role="alert" testID="trace-problem">{start.error instanceof ApiError ? start.error.message : 'The trace could not be started.'}</Text> : null}
      {trace && trace.status !== 'done' ? <TraceProgress trace={trace} /> : null}
      {trace?.status === 'failed' ? <Text style={styles.problem} role="alert" testID="trace-failed">{trace.message}</Text> : null}
      {trace && (trace.status === 'failed' || trace.status === 'done') ? <Text variant="caption" onPress={() => router.setParams({ trace: '' })} testID="trace-again" style={styles.link}>Mark the photo and trace again</Text> : null}
      {trace?.status === 'done' && trace.result ? <TraceEditor jobId={jobId} pieceId={pieceId} trace={{ ...trace, result: trace.result }} onSaved={() => undefined} /> : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  photos: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  thumb: { width: 72, height: 72, borderRadius: radius.md, overflow: 'hidden', borderWidth: 2, borderColor: colors.line },
  chosen: { borderColor: colors.accent },
  image: { width: '100%', height: '100%' },
  problem: { color: colors.danger },
  link: { color: colors.accent, textDecorationLine: 'underline' },
});
