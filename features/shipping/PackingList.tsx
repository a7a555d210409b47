import { StyleSheet, View } from 'react-native';
import { pieceKindLabels, type PieceKind } from '../pieces/schema';
import { Button } from '../ui/Button';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import type { JobShipping } from './schema';
import { lengthUnit } from './shippingWords';
import { canPrint, printPage } from './printPage';

const kindWord = (kind: string) => pieceKindLabels[kind as PieceKind]?.toLowerCase() ?? kind;

function Block({ title, lines }: { title: string; lines: string[] }) {
  return (
    <View style={styles.block}>
      <Text variant="label">{title}</Text>
      {lines.map((line) => (
        <Text key={line}>• {line}</Text>
      ))}
    </View>
  );
}

/** What goes in the box and how it is protected, for the person packing it. */
export function PackingList({ shipping, glazingLabel, acrylic }: { shipping: JobShipping; glazingLabel: string | null; acrylic: boolean }) {
  const p = shipping.packing;
  if (!p) return null;
  const contents = [
    `The framed piece${p.mouldingName ? ` in ${p.mouldingName}` : ''}, ${p.outerWidthIn} x ${p.outerHeightIn} in inside the frame${glazingLabel ? `, glazed with ${glazingLabel.toLowerCase()}` : ''}`,
    `${p.matCount} ${p.matCount === 1 ? 'mat' : 'mats'} and a mounting board, fitted`,
    ...p.pieces.map((piece) => `${piece.label} (${kindWord(piece.kind)}), mounted in the frame`),
  ];
  const protection = [
    'Corner protectors on all four corners of the frame',
    `The glazing face covered with a rigid sheet of board so nothing can press on it${acrylic ? '' : '; glass taped across so a break cannot scatter'}`,
    `${shipping.padding} ${lengthUnit(shipping.units)} of padding on every side of the frame inside the box`,
    'The frame cannot move when the closed box is shaken',
  ];
  const marks = ['THIS SIDE UP, with arrows on all four sides', 'Fragile: framed artwork', ...(acrylic ? ['Acrylic: do not use glass cleaner'] : [])];
  return (
    <View style={styles.box} testID="packing-list">
      <View style={styles.head}>
        <Text variant="heading">Packing list</Text>
        {canPrint ? <Button label="Print" kind="quiet" onPress={printPage} /> : null}
      </View>
      <Block title="In the box" lines={contents} />
      <Block title="Protection" lines={protection} />
      <Block title="On the box and the card inside" lines={marks} />
      {acrylic ? <Text variant="caption">Acrylic clouds and crazes with ammonia or alcohol glass cleaners: a soft cloth with an acrylic cleaner or mild soapy water only.</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line },
  head: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center', flexWrap: 'wrap' },
  block: { gap: space.xs },
});
