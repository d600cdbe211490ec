/** The one bounded cache: its bounds, its eviction, caches per settings content, flat copies of keys. */
import { describe, expect, it } from 'vitest';
import { BoundedCache, CachesBySettings, detach, settingsKey } from '../../server/src/chem/cache';

describe('BoundedCache', () => {
  it('keeps at most maxEntries, evicting the least recently used', () => {
    const c = new BoundedCache<number>(3, 1e9);
    for (const k of ['a', 'b', 'c']) c.set(k, k.charCodeAt(0));
    expect(c.get('a')).toBe(97); // a is now the most recent
    c.set('d', 100);
    expect(c.has('b')).toBe(false);
    expect([c.has('a'), c.has('c'), c.has('d')]).toEqual([true, true, true]);
    expect(c.size).toBe(3);
  });

  it('keeps at most maxBytes (keys and values), and refuses a value larger than the budget', () => {
    const c = new BoundedCache<string>(1000, 1000);
    c.set('x'.repeat(100), 'v', 300); // 2·100 + 32 + 300 = 532 bytes
    c.set('y'.repeat(100), 'w', 300);
    expect(c.size).toBe(1);
    expect(c.bytes).toBeLessThanOrEqual(1000);
    c.set('z', 'huge', 5000);
    expect(c.has('z')).toBe(false);
    c.delete('y'.repeat(100));
    expect(c.bytes).toBe(0);
  });

  it('replacing a key does not count it twice', () => {
    const c = new BoundedCache<number>(10, 1e6);
    c.set('k', 1, 100);
    c.set('k', 2, 100);
    expect(c.size).toBe(1);
    expect(c.bytes).toBe(2 + 32 + 100);
    expect(c.get('k')).toBe(2);
  });

  it('one cache per settings content, not per settings object; a few settings at most', () => {
    const family = new CachesBySettings<number>(10, 1e6, 2);
    const a = family.for({ decimals: 2, chem: { ionicAbove: 1.8 } });
    a.set('NaCl', 1);
    expect(family.for({ chem: { ionicAbove: 1.8 }, decimals: 2 }).get('NaCl')).toBe(1);
    expect(settingsKey({ a: 1, b: { c: 2 } })).toBe(settingsKey({ b: { c: 2 }, a: 1 }));
    expect(settingsKey({ a: 1, b: { c: 2 } })).not.toBe(settingsKey({ a: 1, b: { c: 3 } }));
    family.for({ decimals: 3 });
    family.for({ decimals: 4 });
    expect(family.for({ decimals: 2, chem: { ionicAbove: 1.8 } }).get('NaCl')).toBeUndefined();
  });

  it('detach gives an equal string', () => {
    const big = 'ab'.repeat(1000) + '🧪';
    for (const s of ['', 'a', big.slice(3, 20), big.slice(100, 1500), big]) expect(detach(s)).toBe(s);
  });
});
