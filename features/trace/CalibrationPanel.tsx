import { useQuery } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { BoardPoint } from '../../geometry';
import { referenceRectangles } from '../../geometry/trace/calibration';
import { photoUrl } from '../pieces/queries';
import type { PhotoSummary } from '../pieces/schema';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { space } from '../ui/theme';
import { CornerMarks } from './CornerMarks';
import { traceQueries } from './queries';
import type { TraceRequest } from './schema';

type Mode = 'rectangle' | 'twoPoints';
const sizeOptions = [...referenceRectangles.map((r) => ({ value: r.id as string, label: r.label })), { value: 'typed', label: 'Another size' }];

/** Marks inset from the photo's corners, for when no rectangle was found. */
function defaultMarks(mode: Mode, w: number, h: number): BoardPoint[] {
  if (mode === 'twoPoints') return [{ x: w * 0.3, y: h * 0.5 }, { x: w * 0.7, y: h * 0.5 }];
  return [{ x: w * 0.25, y: h * 0.25 }, { x: w * 0.75, y: h * 0.25 }, { x: w * 0.75, y: h * 0.75 }, { x: w * 0.25, y: h * 0.75 }];
}

const inches = (text: string) => Number(text.replace(',', '.'));

interface Props {
  photo: PhotoSummary;
  busy: boolean;
  onTrace: (request: TraceRequest) => void;
}

/** The known rectangle's corners (proposed, then dragged) and its size, or two points and a distance. */
export function CalibrationPanel({ photo, busy, onTrace }: Props) {
  const proposal = useQuery(traceQueries.corners(photo.id));
  const [mode, setMode] = useState<Mode>('rectangle');
  const [marks, setMarks] = useState<BoardPoint[]>(() => defaultMarks('rectangle', photo.widthPx, photo.heightPx));
  const [sizeId, setSizeId] = useState<string>('letter');
  const [typed, setTyped] = useState({ width: '', height: '', distance: '' });
  const [background, setBackground] = useState<BoardPoint | null>(null);
  const [picking, setPicking] = useState(false);
  const [box, setBox] = useState<BoardPoint[] | null>(null);
  const proposed = proposal.data?.corners ?? null;

  useEffect(() => {
    if (mode === 'rectangle' && proposed) setMarks(proposed);
  }, [proposed, mode]);

  const switchMode = (next: Mode) => {
    setMode(next);
    setMarks(next === 'rectangle' && proposed ? proposed : defaultMarks(next, photo.widthPx, photo.heightPx));
  };
  const preset = referenceRectangles.find((r) => r.id === sizeId);
  const submit = () => {
    const calibration: TraceRequest['calibration'] =
      mode === 'twoPoints'
        ? { kind: 'twoPoints', from: marks[0]!, to: marks[1]!, distanceIn: inches(typed.distance) }
        : { kind: 'rectangle', corners: marks, widthIn: preset ? preset.widthIn : inches(typed.width), heightIn: preset ? preset.heightIn : inches(typed.height) };
    const area = box
      ? { x: Math.min(box[0]!.x, box[1]!.x), y: Math.min(box[0]!.y, box[1]!.y), width: Math.max(1, Math.abs(box[1]!.x - box[0]!.x)), height: Math.max(1, Math.abs(box[1]!.y - box[0]!.y)) }
      : null;
    onTrace({ photoId: photo.id, calibration, background, box: area });
  };

  return (
    <View style={styles.panel}>
      <ChoiceChips label="Scale from" value={mode} onChange={switchMode} testID="calibration-mode"
        options={[{ value: 'rectangle', label: 'Four corners of a rectangle' }, { value: 'twoPoints', label: 'Two points and a distance' }]} />
      {mode === 'rectangle' ? (
        <Text variant="caption" testID="corner-status">
          {proposal.isPending ? 'Looking for a rectangle in the photo…' : proposed ? 'Matwright found a rectangle and marked its corners. Drag any mark that is off its corner.' : 'No rectangle stood out; drag marks 1 to 4 onto its corners, in order round it.'}
        </Text>
      ) : (
        <Notice title="Scale only">A photo taken at an angle will be off with two points: only the distance between them is true. Use a rectangle’s four corners when you can.</Notice>
      )}
      <CornerMarks photoHref={photoUrl(photo.id)} widthPx={photo.widthPx} heightPx={photo.heightPx} marks={marks} onMarksChange={setMarks}
        background={background} pickingBackground={picking} onBackground={(p) => { setBackground(p); setPicking(false); }} box={box} onBoxChange={setBox} />
      {mode === 'rectangle' ? (
        <>
          <ChoiceChips label="The rectangle is" value={sizeId} onChange={setSizeId} options={sizeOptions} testID="rectangle-size" />
          {preset ? <Text variant="caption">{preset.label} ({preset.source}).</Text> : (
            <View style={styles.row}>
              <TextField label="Width (in)" value={typed.width} onChangeText={(width) => setTyped({ ...typed, width })} keyboardType="decimal-pad" testID="rectangle-width" />
              <TextField label="Height (in)" value={typed.height} onChangeText={(height) => setTyped({ ...typed, height })} keyboardType="decimal-pad" testID="rectangle-height" />
            </View>
          )}
        </>
      ) : (
        <TextField label="Distance between the points (in)" value={typed.distance} onChangeText={(distance) => setTyped({ ...typed, distance })} keyboardType="decimal-pad" testID="calibration-distance" />
      )}
      <View style={styles.row}>
        <Button kind="quiet" label={picking ? 'Tap the bare board on the photo…' : background ? 'Pick the board colour again' : 'Tap to pick the board colour'} onPress={() => setPicking(!picking)} testID="pick-background" />
        {background ? <Button kind="quiet" label="Forget the board colour" onPress={() => setBackground(null)} /> : null}
        <Button kind="quiet" label={box ? 'Remove the box' : 'Box round the garment'} testID="garment-box-toggle"
          onPress={() => setBox(box ? null : [{ x: photo.widthPx * 0.1, y: photo.heightPx * 0.1 }, { x: photo.widthPx * 0.6, y: photo.heightPx * 0.9 }])} />
      </View>
      {box ? <Text variant="caption">Drag the two square handles so the box holds the whole garment with a little bare board on every side. Everything outside the box is taken as board; inside it, the garment is told apart by its colours as a whole region (a graph cut), so a garment close in colour to the board can still be traced. Tracing with a box takes a few seconds longer.</Text> : null}
      <Button label="Trace the garment" onPress={submit} busy={busy} testID="start-trace" />
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: space.md },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
