/**
 * Memoisation with bounds: the one cache every layer uses.
 *
 * A `BoundedCache` keeps at most `maxEntries` entries and at most `maxBytes` (estimated) bytes, and
 * evicts entries not read lately first (the clock algorithm). Keys are strings, and callers store flat copies
 * (`detach`) of keys cut from larger texts: in V8 a slice of 13 or more characters is a view into its
 * parent string, so a cache keyed by slices of a 1 MB note would hold every version of the note ever
 * typed. The same holds for values that keep slices: compute them from the flat copy.
 *
 * `cacheFor(settings, …)` gives one cache per distinct settings *content* (not per object), keeping the
 * few most recently used settings, so a new but equal settings object finds the cache warm and a
 * changed one neither clears nor grows without bound.
 */

/**
 * A copy of `s` that shares no storage with any string it was cut from. Concatenating forces a new
 * string of the concatenation's length; slicing that copies nothing more than `s` itself.
 */
export function detach(s: string): string {
  return s.length < 13 ? s : (' ' + s).slice(1);
}

/** Estimated bytes of a string held in a cache (UTF-16 worst case, plus the object header). */
export const stringBytes = (s: string): number => 2 * s.length + 32;

interface Entry<V> {
  /** The key as stored (the flat copy given to `set`). */
  key: string;
  value: V;
  bytes: number;
  /** Read since the clock hand last passed it. */
  hot: boolean;
}

/**
 * Eviction by the clock algorithm (an approximation of least recently used that costs a flag write per
 * read instead of a reordering): a hand goes round the entries in insertion order; an entry read since the
 * hand last passed gets a second chance, any other is evicted. The hand is a live Map iterator, so it
 * keeps its place between evictions and never rescans what it has passed.
 */
export class BoundedCache<V> {
  private readonly map = new Map<string, Entry<V>>();
  private used = 0;
  private hand: IterableIterator<[string, Entry<V>]> = this.map.entries();

  constructor(
    readonly maxEntries: number,
    readonly maxBytes: number,
  ) {}

  get size(): number {
    return this.map.size;
  }

  /** Estimated bytes held (keys and values). */
  get bytes(): number {
    return this.used;
  }

  get(key: string): V | undefined {
    const e = this.map.get(key);
    if (!e) return undefined;
    e.hot = true;
    return e.value;
  }

  has(key: string): boolean {
    return this.map.has(key);
  }

  /**
   * Remember `value` under `key`; `valueBytes` estimates what the value holds. A value larger than the
   * whole budget is not kept. The key is kept as given: pass a flat copy (`detach`) of a key cut from a
   * larger text, or that text stays alive with the entry.
   */
  set(key: string, value: V, valueBytes = 0): void {
    const bytes = stringBytes(key) + valueBytes;
    const old = this.map.get(key);
    if (old) {
      this.used -= old.bytes;
      this.map.delete(key);
    }
    if (bytes > this.maxBytes) return;
    this.map.set(key, { key, value, bytes, hot: false });
    this.used += bytes;
    if (this.map.size > this.maxEntries || this.used > this.maxBytes) this.evict();
  }

  delete(key: string): void {
    const e = this.map.get(key);
    if (!e) return;
    this.used -= e.bytes;
    this.map.delete(key);
  }

  clear(): void {
    this.map.clear();
    this.used = 0;
    this.hand = this.map.entries();
  }

  private evict() {
    while (this.map.size > this.maxEntries || this.used > this.maxBytes) {
      let step = this.hand.next();
      if (step.done) {
        this.hand = this.map.entries();
        step = this.hand.next();
        if (step.done) return;
      }
      const [k, e] = step.value;
      if (e.hot) {
        e.hot = false;
        continue;
      }
      this.map.delete(k);
      this.used -= e.bytes;
    }
  }
}

const fingerprints = new WeakMap<object, string>();

/** A stable text of a settings object's content (memoised per object). */
export function settingsKey(settings: object): string {
  let k = fingerprints.get(settings);
  if (k === undefined) fingerprints.set(settings, (k = JSON.stringify(settings, Object.keys(flatten(settings)).sort())));
  return k;
}

/** All keys of a nested plain object, so that JSON.stringify's key list reaches nested values. */
function flatten(o: object, out: Record<string, true> = {}): Record<string, true> {
  for (const [k, v] of Object.entries(o)) {
    out[k] = true;
    if (v && typeof v === 'object') flatten(v as object, out);
  }
  return out;
}

/** A family of caches, one per settings content; at most `keep` settings are remembered. */
export class CachesBySettings<V> {
  private readonly bySettings = new Map<string, BoundedCache<V>>();

  constructor(
    private readonly maxEntries: number,
    private readonly maxBytes: number,
    private readonly keep = 4,
  ) {}

  private last: { settings: object; cache: BoundedCache<V> } | undefined;

  for(settings: object): BoundedCache<V> {
    // The same settings object as last time (nearly every call): no lookup at all.
    if (this.last?.settings === settings) return this.last.cache;
    const cache = this.lookup(settings);
    this.last = { settings, cache };
    return cache;
  }

  private lookup(settings: object): BoundedCache<V> {
    const key = settingsKey(settings);
    let c = this.bySettings.get(key);
    if (c) {
      this.bySettings.delete(key);
      this.bySettings.set(key, c);
      return c;
    }
    c = new BoundedCache<V>(this.maxEntries, this.maxBytes);
    this.bySettings.set(key, c);
    if (this.bySettings.size > this.keep) this.bySettings.delete(this.bySettings.keys().next().value as string);
    return c;
  }

  clear(): void {
    this.bySettings.clear();
    this.last = undefined;
  }
}

/** Caches of what follows from a formula's analysis alone, keyed by its text: cleared with the formula cache. */
const analysisDerived = new Set<BoundedCache<unknown>>();

/**
 * A bounded cache of something computed from a formula's analysis (its cautions, its dissociation), keyed
 * by the analysis's text; `clearAnalysisDerived` (called by `clearFormulaCache`) empties it, so a cold
 * start is cold for these too.
 */
export function analysisDerivedCache<V>(maxEntries: number, maxBytes: number): BoundedCache<V> {
  const c = new BoundedCache<V>(maxEntries, maxBytes);
  analysisDerived.add(c as BoundedCache<unknown>);
  return c;
}

export function clearAnalysisDerived(): void {
  for (const c of analysisDerived) c.clear();
}
