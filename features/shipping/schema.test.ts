import { describe, expect, it } from 'vitest';
import { defaultShopSettings, shopSettings } from '../settings/schema';
import { carrier, defaultShippingSettings, shipmentInput, shippingSettings, trackingLink } from './schema';

describe('shipping settings', () => {
  it('fill in the defaults for a shop saved before shipping existed (divisor 139: UPS and FedEx published rule)', () => {
    const { shipping: _omitted, ...older } = defaultShopSettings;
    const parsed = shopSettings.parse(older);
    expect(parsed.shipping).toEqual(defaultShippingSettings);
    expect(parsed.shipping.divisor).toBe(139);
    expect(parsed.shipping.padding).toBe(2);
  });

  it('refuse a tracking address without {tracking}, one that is not http(s), and two carriers of the same name', () => {
    expect(carrier.safeParse({ name: 'Parcel carrier', trackingUrl: 'https://parcels.example/track' }).error?.issues[0]?.message).toBe('Put {tracking} where the tracking number goes');
    expect(carrier.safeParse({ name: 'Parcel carrier', trackingUrl: 'javascript:alert({tracking})' }).success).toBe(false);
    const twice = shippingSettings.safeParse({ ...defaultShippingSettings, carriers: [defaultShippingSettings.carriers[0], { ...defaultShippingSettings.carriers[1]!, name: 'PARCEL CARRIER' }] });
    expect(twice.error?.issues[0]?.message).toBe('Two carriers have the same name');
  });

  it('refuse negative weights and a zero divisor with the field named', () => {
    const bad = shippingSettings.safeParse({ ...defaultShippingSettings, boxWeight: -1, divisor: 0 });
    expect(bad.error?.issues.map((i) => i.path.join('.')).sort()).toEqual(['boxWeight', 'divisor']);
  });
});

describe('tracking links', () => {
  it('put the URL-encoded number where {tracking} stands, so a number cannot change the address', () => {
    expect(trackingLink('https://parcels.example/track?number={tracking}', '1Z 99')).toBe('https://parcels.example/track?number=1Z%2099');
    expect(trackingLink('https://freight.example/t/{tracking}/{tracking}', 'AB-1')).toBe('https://freight.example/t/AB-1/AB-1');
  });

  it('accept letters, digits, spaces and dashes only in a tracking number', () => {
    expect(shipmentInput.safeParse({ carrier: 'Parcel carrier', trackingNumber: '  1Z-99 X ' }).data?.trackingNumber).toBe('1Z-99 X');
    expect(shipmentInput.safeParse({ carrier: 'Parcel carrier', trackingNumber: '1Z/../x' }).success).toBe(false);
    expect(shipmentInput.safeParse({ carrier: 'Parcel carrier', trackingNumber: '' }).error?.issues[0]?.message).toBe('Type the tracking number');
  });
});
