/**
 * A memo with a size bound and no bookkeeping on a hit: two generations of at most
 * `capacity / 2` entries each. New entries go into the young one; when it is full it
 * becomes the old one and the previous old one is dropped. A hit in the old generation
 * moves the entry to the young one, so what is used in every generation (the words on
 * every card) stays, and what was used once (a card's own web address) ages out.
 */
export class BoundedCache<K, V> {
  private young = new Map<K, V>();
  private old = new Map<K, V>();
  private readonly generation: number;

  /** At most `capacity` entries (at least 2) are held. */
  constructor(readonly capacity: number) {
    if (!Number.isInteger(capacity) || capacity < 2) {
      throw new Error(`BoundedCache: capacity must be a whole number ≥ 2, got ${capacity}`);
    }
    this.generation = Math.floor(capacity / 2);
  }

  get(key: K): V | undefined {
    const young = this.young.get(key);
    if (young !== undefined) return young;
    const old = this.old.get(key);
    if (old !== undefined) {
      this.old.delete(key);
      this.set(key, old);
    }
    return old;
  }

  set(key: K, value: V): void {
    if (!this.young.has(key) && this.young.size >= this.generation) {
      this.old = this.young;
      this.young = new Map();
    }
    this.old.delete(key);
    this.young.set(key, value);
  }

  /** Entries held, never above `capacity`. */
  get size(): number {
    return this.young.size + this.old.size;
  }

  clear(): void {
    this.young = new Map();
    this.old = new Map();
  }
}
