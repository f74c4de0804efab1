/** BoundedCache: a size-bounded memo of two generations (generator/render/bounded-cache.ts). */
import { describe, expect, it } from 'vitest';
import { BoundedCache } from '../../generator/render/bounded-cache.ts';

describe('BoundedCache', () => {
  it('never holds more than its capacity, over many distinct keys', () => {
    const cache = new BoundedCache<string, number>(100);
    for (let i = 0; i < 10_000; i++) {
      cache.set(`word ${i}`, i);
      cache.get(`word ${i >> 1}`);
      expect(cache.size).toBeLessThanOrEqual(100);
    }
  });

  it('returns what was set, until it ages out', () => {
    const cache = new BoundedCache<string, number>(10);
    cache.set('a', 1);
    expect(cache.get('a')).toBe(1);
    expect(cache.get('b')).toBeUndefined();
    for (let i = 0; i < 10; i++) cache.set(`x${i}`, i);
    expect(cache.get('a'), 'two generations of other keys later').toBeUndefined();
  });

  it('keeps a key used in every generation, whatever else passes through', () => {
    const cache = new BoundedCache<string, number>(8);
    cache.set('common', 0);
    for (let i = 0; i < 1000; i++) {
      cache.set(`once ${i}`, i);
      expect(cache.get('common'), `after ${i + 1} other keys`).toBe(0);
    }
  });

  it('setting a key again replaces its value and does not count it twice', () => {
    const cache = new BoundedCache<string, number>(4);
    for (let i = 0; i < 10; i++) cache.set('k', i);
    expect(cache.get('k')).toBe(9);
    expect(cache.size).toBe(1);
  });

  it('refuses a capacity below 2', () => {
    expect(() => new BoundedCache(1)).toThrow(/capacity/);
  });
});
