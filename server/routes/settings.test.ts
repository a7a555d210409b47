import { afterAll, describe, expect, it } from 'vitest';
import { defaultShopSettings } from '../../features/settings/schema';
import { addMember, createHarness, signUpShop } from '../test/harness';

const h = createHarness();
afterAll(() => h.database.close());

describe('shop settings', () => {
  it('a new shop reads the common-practice defaults: 1/4 in reveal, 1/2 in and 1/4 in bridge, 45 degree bevel', async () => {
    const { agent } = await signUpShop(h);
    const { settings } = (await agent.get('/api/settings')).body;
    // Common practice (trade references): reveal 1/4 in typical; bridge 1/2 in typical; bevel 45 degrees.
    expect(settings.defaultRevealIn).toBe(0.25);
    expect(settings.bridgeWarnIn).toBe(0.5);
    expect(settings.bridgeErrorIn).toBe(0.25);
    expect(settings.bevelAngleDeg).toBe(45);
  });

  it('the owner saves settings and every member reads them back', async () => {
    const { agent, shopId } = await signUpShop(h);
    const changed = { ...defaultShopSettings, rounding: '1/32', bridgeWarnIn: 0.625 };
    expect((await agent.put('/api/settings').send(changed)).status).toBe(200);
    const desk = await addMember(h, shopId, 'front_desk');
    const read = (await desk.get('/api/settings')).body.settings;
    expect(read.rounding).toBe('1/32');
    expect(read.bridgeWarnIn).toBe(0.625);
  });

  it("one shop's saved settings never show in another shop", async () => {
    const mine = await signUpShop(h);
    await mine.agent.put('/api/settings').send({ ...defaultShopSettings, rounding: '1/8', defaultRevealIn: 0.375 });
    const other = await signUpShop(h, 'Neighbouring Frames');
    const read = (await other.agent.get('/api/settings')).body.settings;
    expect(read.rounding).toBe(defaultShopSettings.rounding);
    expect(read.defaultRevealIn).toBe(defaultShopSettings.defaultRevealIn);
  });

  it('designers and front desk may not change settings (403)', async () => {
    const { shopId } = await signUpShop(h);
    for (const role of ['designer', 'front_desk'] as const) {
      const member = await addMember(h, shopId, role);
      expect((await member.put('/api/settings').send(defaultShopSettings)).status).toBe(403);
    }
  });

  it('bad settings are refused with the fields named, and the stored ones are kept', async () => {
    const { agent } = await signUpShop(h);
    const res = await agent.put('/api/settings').send({ ...defaultShopSettings, bevelAngleDeg: 90, bridgeErrorIn: 'wide' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['bevelAngleDeg', 'bridgeErrorIn']);
    expect((await agent.get('/api/settings')).body.settings.bevelAngleDeg).toBe(45);
  });

  it('an error width above the warning width is refused', async () => {
    const { agent } = await signUpShop(h);
    const res = await agent.put('/api/settings').send({ ...defaultShopSettings, bridgeErrorIn: 0.75, bridgeWarnIn: 0.5 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.bridgeErrorIn).toMatch(/warning/);
  });

  it('two stock boards with one id are refused', async () => {
    const { agent } = await signUpShop(h);
    const board = defaultShopSettings.stock[0]!;
    const res = await agent.put('/api/settings').send({ ...defaultShopSettings, stock: [board, { ...board, name: 'Copy' }] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['stock.1.id']).toBe('This id is used twice');
  });
});
