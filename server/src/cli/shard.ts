/**
 * `check --shard <i>/<n>`: the i-th of n disjoint parts of the files found, so that n CI jobs together
 * check each file exactly once. A file's part depends on its path alone — the path relative to the
 * working folder, with `/` between its segments, hashed (FNV-1a, 32 bits) modulo n — so every job splits
 * the same way whatever the machine, and adding a file never moves another file to a different part.
 * What the walk reports about a path (a file or folder not read, a link not followed) is reported by the
 * job whose part that path falls in.
 */
import { isAbsolute, relative, resolve, sep } from 'node:path';
import { UsageError } from './io';

export interface Shard {
  /** 1-based. */
  index: number;
  count: number;
}

/** Most parts a folder may be split into. */
export const MAX_SHARDS = 10_000;

export function readShard(text: string): Shard {
  const m = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(text);
  const index = m ? Number(m[1]) : NaN;
  const count = m ? Number(m[2]) : NaN;
  if (!m || !(count >= 1) || !(index >= 1) || index > count || count > MAX_SHARDS)
    throw new UsageError(`--shard must be <i>/<n> with 1 ≤ i ≤ n ≤ ${MAX_SHARDS} (got '${text}')`);
  return { index, count };
}

/** The path a file is split by: relative to the working folder where it is inside it, `/`-separated. */
export function shardKey(path: string, cwd: string): string {
  const abs = resolve(cwd, path);
  const rel = relative(cwd, abs);
  const key = rel && !isAbsolute(rel) && !rel.startsWith('..') ? rel : abs;
  return key.split(sep).join('/');
}

/** FNV-1a over the UTF-16 code units of the key. */
function fnv1a(key: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < key.length; i++) {
    h ^= key.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}

/** The part (1-based) a path falls in. */
export const shardOf = (key: string, count: number): number => (fnv1a(key) % count) + 1;

/** Whether a path is in this job's part. */
export function inShard(shard: Shard | undefined, path: string, cwd: string): boolean {
  return !shard || shardOf(shardKey(path, cwd), shard.count) === shard.index;
}
