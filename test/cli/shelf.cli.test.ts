/**
 * The lab's shelf file through the command line (the built dist/cli.js): a note names reagents by their
 * shelf labels, and `check` and `batch` read them with the shelf file of the folder (or beside the file
 * named), also in worker threads. An invented lab (Tamsin Road Finishing). 10 mL × 1.84 g/mL = 18.4 g.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { tempFolders } from '../temp';

const mkdtempSync = tempFolders();
const CLI = join(__dirname, '../../dist/cli.js');
const cli = (args: string[], cwd: string) => spawnSync('node', [CLI, ...args], { cwd, encoding: 'utf8' });

function lab(): string {
  const dir = mkdtempSync(join(tmpdir(), 'ionwright-shelf-'));
  writeFileSync(join(dir, 'shelf.md'), '# Shelf\n\n```shelf\nAcid A: H2SO4 @ 96 %; density 1.84 g/mL; lot SA-2231\n```\n');
  writeFileSync(join(dir, 'monday.md'), '# Monday\n\n```batch\nname: Rinse acid\nAcid A 10 mL\nwater to 2 L\n```\n');
  return dir;
}

describe('the shelf file', () => {
  it('is read for a folder, in one thread and in workers', () => {
    const dir = lab();
    for (const jobs of ['1', '2']) {
      const r = cli(['check', '--jobs', jobs, '.'], dir);
      expect(r.stdout, jobs).toContain('2 files checked: 0 errors, 0 warnings.');
      expect(r.status).toBe(0);
    }
  });

  it('is read in every shard, whichever shard checks it', () => {
    // The shelf file in a folder of its own, not beside any note: only the walk finds it.
    const dir = mkdtempSync(join(tmpdir(), 'ionwright-shards-'));
    mkdirSync(join(dir, 'reagents'));
    writeFileSync(join(dir, 'reagents', 'lab.shelf.md'), '```shelf\nAcid A: H2SO4 @ 96 %; density 1.84 g/mL\n```\n');
    for (const day of ['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday'])
      writeFileSync(join(dir, `${day}.md`), '```batch\nAcid A 5 mL\nwater to 1 L\n```\n');
    const counts: number[] = [];
    for (const shard of ['1/2', '2/2']) {
      const r = cli(['check', '--shard', shard, '.'], dir);
      expect(r.stdout, shard).toMatch(/: 0 errors/);
      expect(r.status, shard).toBe(0);
      counts.push(Number(/^(\d+) files? checked/m.exec(r.stdout)?.[1]));
    }
    // Not vacuous: both shards check notes, so one of them checks notes without the shelf file.
    expect(counts.every((n) => n > 0)).toBe(true);
  });

  it('is read beside a file named on its own, and its entry is in the batch JSON', () => {
    const dir = lab();
    const r = cli(['batch', 'monday.md', '--json'], dir);
    const [b] = JSON.parse(r.stdout);
    expect(b.skipped).toEqual([]);
    expect(b.ingredients[0]).toMatchObject({
      formula: 'H2SO4',
      written: 'Acid A',
      hill: 'H2O4S',
      via: 'shelf',
      shelf: { label: 'Acid A', lot: 'SA-2231' },
      volumeML: 10,
    });
    expect(b.ingredients[0].massG).toBeCloseTo(18.4, 9);
  });

  it('without it, the label is a finding on the line', () => {
    const dir = mkdtempSync(join(tmpdir(), 'ionwright-noshelf-'));
    writeFileSync(join(dir, 'monday.md'), '```batch\nAcid A 10 mL\nwater to 2 L\n```\n');
    const r = cli(['check', 'monday.md'], dir);
    expect(r.stdout).toMatch(/monday\.md:2:1 error batch-name/);
    expect(r.status).toBe(1);
  });
});
