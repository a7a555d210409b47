import { useState } from 'react';
import { Linking, StyleSheet, View } from 'react-native';
import { ApiError } from '../api/client';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { space } from '../ui/theme';
import type { useMarkShipped } from './queries';
import type { Carrier, Shipment } from './schema';
import { dayText } from '../ui/dates';

/** The carrier and tracking number, once shipped. */
export function ShipmentLine({ shipment }: { shipment: Shipment }) {
  return (
    <View style={styles.box} testID="shipment">
      <Text>
        Shipped {dayText(shipment.shippedAt)} with {shipment.carrier}, tracking number {shipment.trackingNumber}
        {shipment.shippedByName ? ` (by ${shipment.shippedByName})` : ''}.
      </Text>
      <Button label="Open the tracking page" kind="quiet" onPress={() => void Linking.openURL(shipment.trackingUrl)} />
    </View>
  );
}

/** Marks the job shipped with a carrier and tracking number, and e-mails the customer the tracking and arrival links. */
export function ShipForm({ ship, carriers }: { ship: ReturnType<typeof useMarkShipped>; carriers: Carrier[] }) {
  const [carrier, setCarrier] = useState(carriers[0]?.name ?? '');
  const [tracking, setTracking] = useState('');
  const fields = ship.error instanceof ApiError ? ship.error.fields : {};
  if (carriers.length === 0) return <Notice tone="info">Add a carrier with its tracking page in the shop settings to mark jobs shipped.</Notice>;
  return (
    <View style={styles.box}>
      <ChoiceChips label="Carrier" options={carriers.map((c) => ({ value: c.name, label: c.name }))} value={carrier} onChange={setCarrier} testID="carrier" />
      <TextField label="Tracking number" value={tracking} onChangeText={setTracking} autoCapitalize="characters" error={fields.trackingNumber ?? fields.carrier} testID="tracking-number" />
      {ship.isError && !fields.trackingNumber && !fields.carrier ? <Notice>{ship.error.message}</Notice> : null}
      <Button label="Mark shipped and e-mail the customer" busy={ship.isPending} onPress={() => ship.mutate({ carrier, trackingNumber: tracking, emailCustomer: true })} testID="mark-shipped" />
      <Text variant="caption">The e-mail holds the tracking link and a link where the customer can tell you how the frame arrived.</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm },
});
