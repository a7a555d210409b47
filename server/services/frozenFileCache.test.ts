import { describe, expect, it } from 'vitest';
import { createFrozenFileCache, frozenFileKey } from './frozenFileCache';

const file = (body: string) => async () => ({ body });

describe('files kept from frozen versions', () => {
  it('makes a file once for requests that arrive while it is being made', async () => {
    const cache = createFrozenFileCache(1024 * 1024);
    let made = 0;
    const make = async () => {
      made++;
      await new Promise((resolve) => setTimeout(resolve, 20));
      return { body: 'MAT1' };
    };
    const bodies = await Promise.all([cache.obtain('v1:a', make), cache.obtain('v1:a', make), cache.obtain('v1:a', make)]);
    expect(bodies.map((b) => b.body)).toEqual(['MAT1', 'MAT1', 'MAT1']);
    expect(made).toBe(1);
    await cache.obtain('v1:a', make);
    expect(made).toBe(1);
  });

  it('keeps no refusal: the next request makes the file again', async () => {
    const cache = createFrozenFileCache(1024 * 1024);
    await expect(cache.obtain('v1:a', async () => Promise.reject(new Error('cannot cut')))).rejects.toThrow('cannot cut');
    expect(cache.size()).toBe(0);
    expect((await cache.obtain('v1:a', file('MAT1'))).body).toBe('MAT1');
  });

  it('lets the least recently used file go first past its byte budget', async () => {
    // Two bytes a character: a budget of 40 bytes holds two files of 10 characters.
    const cache = createFrozenFileCache(40);
    await cache.obtain('a', file('a'.repeat(10)));
    await cache.obtain('b', file('b'.repeat(10)));
    await cache.obtain('a', file('not used'));
    await cache.obtain('c', file('c'.repeat(10)));
    expect(cache.size()).toBe(40);
    expect((await cache.obtain('a', file('made again'))).body).toBe('a'.repeat(10));
    expect((await cache.obtain('b', file('made again'))).body).toBe('made again');
  });

  it('keys on every input: the same inputs give the same key, any change another', () => {
    const inputs = { kind: 'cutFile', input: { format: 'dxf', mat: '1', rounding: 'sixteenth', profile: { units: 'in' } } };
    expect(frozenFileKey('v1', inputs)).toBe(frozenFileKey('v1', structuredClone(inputs)));
    expect(frozenFileKey('v2', inputs)).not.toBe(frozenFileKey('v1', inputs));
    expect(frozenFileKey('v1', { ...inputs, input: { ...inputs.input, profile: { units: 'mm' } } })).not.toBe(frozenFileKey('v1', inputs));
  });
});
