import { StyleSheet, View } from 'react-native';
import type { Layout, LengthRounding, OpeningLines } from '../../geometry';
import { polygonsBounds } from '../../geometry/polygon';
import { formatLength } from '../../geometry/units';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';
import { matCutSizes, nearestBridge } from './openingNumbers';

interface Props {
  layout: Layout;
  lines: ReadonlyMap<string, OpeningLines>;
  openingId: string;
  rounding: LengthRounding;
  /** While an opening is dragged the numbers wait for it to land. */
  moving: boolean;
}

/** Sight size, each mat's cut size, the reveal bands that show and the nearest bridge, in the shop's rounding. */
export function OpeningNumbersList({ layout, lines, openingId, rounding, moving }: Props) {
  const own = lines.get(openingId);
  if (!own) return <Text variant="caption">This opening cannot be cut as it is; see Checks.</Text>;
  const f = (v: number) => formatLength(v, rounding);
  const sight = polygonsBounds(own.sight.polygons);
  const bridge = moving ? null : nearestBridge(layout, lines, openingId);
  return (
    <View style={styles.list} testID="opening-numbers">
      {sight ? <Row label="Sight size" value={`${f(sight.w)} x ${f(sight.h)}`} /> : null}
      {matCutSizes(own).map((cut) => (
        <View key={cut.matIndex}>
          <Row label={`Mat ${cut.matIndex + 1} cut (${layout.mats[cut.matIndex]?.name ?? ''})`} value={`${f(cut.width)} x ${f(cut.height)}`} />
          {cut.bandBelow !== null ? (
            <Row label={`Mat ${cut.matIndex + 2} band that shows`} value={cut.bandBelow > 0 ? f(cut.bandBelow) : 'none'} warn={cut.bandBelow < layout.checkSettings.minimumBand} />
          ) : null}
        </View>
      ))}
      <Row
        label="Nearest bridge"
        value={moving ? '…' : bridge ? `${f(bridge.width)} to ${'edge' in bridge.to ? `the ${bridge.to.edge} edge` : bridge.to.openingId} (mat ${bridge.matIndex + 1})` : '—'}
        warn={!!bridge && bridge.width < layout.checkSettings.bridgeWarning}
      />
    </View>
  );
}

function Row({ label, value, warn = false }: { label: string; value: string; warn?: boolean }) {
  return (
    <View style={styles.row}>
      <Text variant="caption" style={styles.label}>{label}</Text>
      <Text variant="label" style={warn ? styles.warn : undefined}>{value}{warn ? ' (narrow)' : ''}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.xs },
  row: { flexDirection: 'row', justifyContent: 'space-between', gap: space.sm, flexWrap: 'wrap' },
  label: { flexShrink: 1 },
  warn: { color: colors.danger },
});
