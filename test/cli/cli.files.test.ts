/**
 * The command line and the user's files: the report never lands on a notes file, a page is written
 * whole or not at all, the folder walk stays in the folder named and reads each file once, and files
 * that are not read say why. The real command (dist/cli.js; npm test builds first) on real folders.
 */
import { isUtf8 } from 'node:buffer';
import { spawnSync } from 'node:child_process';
import { chmodSync, linkSync, mkdirSync, readdirSync, readFileSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { decodeNote, firstInvalidUtf8, reasonOf } from '../../server/src/cli/io';
import { run, type CliIO } from '../../server/src/cli/main';
import { tempFolders } from '../temp';

const mkdtempSync = tempFolders();
const CLI = join(__dirname, '../../dist/cli.js');
const cli = (args: string[], cwd: string, timeout = 30_000) => spawnSync('node', [CLI, ...args], { cwd, encoding: 'utf8', timeout });
const NOTE = 'We weighed `NaCl` and `NaXx`.\n';

describe('report --html never writes over what the user wrote', () => {
  const dir = mkdtempSync(join(tmpdir(), 'ionwright-out-'));
  writeFileSync(join(dir, 'notes.md'), NOTE);
  writeFileSync(join(dir, 'other.fnote'), 'formula: KCl\n');
  symlinkSync('notes.md', join(dir, 'page.html'));
  symlinkSync('other.fnote', join(dir, 'other.html'));
  linkSync(join(dir, 'notes.md'), join(dir, 'hard.html'));
  mkdirSync(join(dir, 'folder.html'));
  mkdirSync(join(dir, 'sub'));
  symlinkSync('..', join(dir, 'up'));

  it.each([
    ['notes.md', /notes\.md: will not write the page there: it is a notes file/],
    ['./notes.md', /it is a notes file/],
    ['up/notes.md', /it is a notes file/],
    ['other.fnote', /it is a notes file/],
    ['new.markdown', /it is a notes file/],
    ['page.html', /it is a link to the notes file .*notes\.md/],
    ['other.html', /it is a link to the notes file .*other\.fnote/],
    ['hard.html', /it is the notes file read \(notes\.md\) under another name/],
    ['folder.html', /it is a folder/],
  ])('--html %s is refused: exit 2, one line, the notes untouched', (out, message) => {
    const r = cli(['report', 'notes.md', '--html', out], dir);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(message);
    expect(r.stdout).toBe('');
    expect(readFileSync(join(dir, 'notes.md'), 'utf8')).toBe(NOTE);
    expect(readFileSync(join(dir, 'other.fnote'), 'utf8')).toBe('formula: KCl\n');
  });

  it('writes a new page, replaces an old one (keeping its permissions), and follows a link to a page', () => {
    expect(cli(['report', 'notes.md', '--html', 'sub/new.html'], dir).status).toBe(1);
    expect(readFileSync(join(dir, 'sub/new.html'), 'utf8')).toMatch(/^<!doctype html>/);
    writeFileSync(join(dir, 'sub/old.html'), 'old page');
    chmodSync(join(dir, 'sub/old.html'), 0o640);
    symlinkSync('old.html', join(dir, 'sub/current.html'));
    const r = cli(['report', 'notes.md', '--html', 'sub/current.html'], dir);
    expect(r.stderr).toBe('ionwright: wrote sub/current.html\n');
    expect(readFileSync(join(dir, 'sub/old.html'), 'utf8')).toMatch(/^<!doctype html>/);
    expect(statSync(join(dir, 'sub/old.html')).mode & 0o777).toBe(0o640);
    // The link is still a link, to the page.
    expect(readFileSync(join(dir, 'sub/current.html'), 'utf8')).toBe(readFileSync(join(dir, 'sub/old.html'), 'utf8'));
    expect(readdirSync(join(dir, 'sub')).sort()).toEqual(['current.html', 'new.html', 'old.html']);
  });

  it('a write that fails (file size limit) leaves the old page as it was and no temporary file', () => {
    const scratch = mkdtempSync(join(tmpdir(), 'ionwright-fail-'));
    writeFileSync(join(scratch, 'notes.md'), NOTE);
    writeFileSync(join(scratch, 'page.html'), 'the page of last week');
    // `ulimit -f 1`: files may grow to 512 bytes; the page is far larger, so its write fails with EFBIG.
    for (const out of ['page.html', 'fresh.html']) {
      const r = spawnSync('sh', ['-c', `ulimit -f 1; exec node ${JSON.stringify(CLI)} report notes.md --html ${out}`], { cwd: scratch, encoding: 'utf8' });
      expect(r.status).toBe(2);
      expect(r.stderr).toBe(`ionwright: ${out}: cannot be written: file too large (EFBIG)\n`);
    }
    expect(readFileSync(join(scratch, 'page.html'), 'utf8')).toBe('the page of last week');
    expect(readdirSync(scratch).sort()).toEqual(['notes.md', 'page.html']);
  });

  it('a folder that does not exist: one line with the reason, nothing written', () => {
    const r = cli(['report', 'notes.md', '--html', 'nowhere/page.html'], dir);
    expect(r.status).toBe(2);
    expect(r.stderr).toBe('ionwright: nowhere/page.html: cannot be written: no such file or directory (ENOENT)\n');
  });
});

describe('the folder walk', () => {
  /** notes/ with links of every kind, and a folder beside it that links lead to. */
  function tree() {
    const root = mkdtempSync(join(tmpdir(), 'ionwright-walk-'));
    const notes = join(root, 'notes');
    mkdirSync(join(notes, 'sub'), { recursive: true });
    mkdirSync(join(root, 'outside'));
    writeFileSync(join(notes, 'a.md'), 'We used `NaXx`.\n');
    writeFileSync(join(notes, 'sub', 'b.fnote'), 'formula: Qq2\n');
    writeFileSync(join(root, 'outside', 'o.md'), 'Outside `Zz`.\n');
    symlinkSync('..', join(notes, 'sub', 'up')); // a loop
    symlinkSync('.', join(notes, 'sub', 'here')); // another
    symlinkSync('sub', join(notes, 'sub-again')); // the same folder twice
    symlinkSync('../a.md', join(notes, 'sub', 'a-again.md')); // the same file twice
    symlinkSync('../outside', join(notes, 'elsewhere')); // out of the tree
    symlinkSync('../../outside/o.md', join(notes, 'sub', 'o.md')); // out of the tree, a file
    symlinkSync('nothing-here', join(notes, 'gone')); // broken, not a note's name
    return { root, notes };
  }

  it('reads each file once under its own path, never leaves the folder named, and says once which links it did not follow', () => {
    const { root } = tree();
    const r = cli(['check', 'notes', '--format', 'json'], root, 20_000);
    expect(r.error).toBeUndefined(); // no hang: the loops end
    expect(r.status).toBe(1); // links are no input problem
    const files = (JSON.parse(r.stdout) as Array<{ file: string }>).map((d) => d.file);
    expect(files).toEqual(['notes/a.md', 'notes/sub/b.fnote']);
    expect(r.stderr).toBe(
      'ionwright: note: 7 symbolic links not followed: 2 lead outside the folder checked (notes/elsewhere, notes/sub/o.md); ' +
        '4 lead to what was already read (notes/sub/a-again.md, notes/sub/here, notes/sub/up, 1 more); 1 leads nowhere (notes/gone)\n',
    );
  });

  it('follows links that stay inside the folder, to what it would not read otherwise, in sorted order', () => {
    const { root, notes } = tree();
    mkdirSync(join(notes, '.archive'));
    writeFileSync(join(notes, '.archive', 'old.md'), 'Old `Qq2`.\n');
    symlinkSync('.archive', join(notes, 'archive'));
    const r = cli(['check', 'notes', '--format', 'json'], root);
    const files = [...new Set((JSON.parse(r.stdout) as Array<{ file: string }>).map((d) => d.file))];
    expect(files).toEqual(['notes/a.md', 'notes/archive/old.md', 'notes/sub/b.fnote']);
  });

  it('a link named on the command line is followed: the user named it', () => {
    const { root } = tree();
    const r = cli(['check', join('notes', 'sub', 'o.md'), 'notes/elsewhere', '--format', 'json'], root);
    expect(r.status).toBe(1);
    // The same file both ways: checked once, under the first name given.
    expect((JSON.parse(r.stdout) as Array<{ file: string }>).map((d) => d.file)).toEqual(['notes/sub/o.md']);
    expect(r.stderr).toBe('');
  });

  it('a folder and a file in it named together: the file is checked once', () => {
    const { root } = tree();
    const r = cli(['check', 'notes/a.md', 'notes', '--format', 'json'], root);
    expect((JSON.parse(r.stdout) as Array<{ file: string }>).map((d) => d.file)).toEqual(['notes/a.md', 'notes/sub/b.fnote']);
  });

  it('a deep web of links ends quickly (each folder read once)', () => {
    const root = mkdtempSync(join(tmpdir(), 'ionwright-web-'));
    // Every folder links to every other: without a visited set the paths grow exponentially.
    const names = ['p', 'q', 'r', 's', 't'];
    for (const n of names) mkdirSync(join(root, 'web', n), { recursive: true });
    for (const n of names) {
      writeFileSync(join(root, 'web', n, `${n}.md`), 'Used `NaXx`.\n');
      for (const m of names) if (m !== n) symlinkSync(join('..', m), join(root, 'web', n, `to-${m}`));
    }
    const r = cli(['check', 'web', '--format', 'json'], root, 20_000);
    expect(r.error).toBeUndefined();
    const files = [...new Set((JSON.parse(r.stdout) as Array<{ file: string }>).map((d) => d.file))];
    expect(files).toEqual(names.map((n) => `web/${n}/${n}.md`));
    expect(r.stderr).toMatch(
      /^ionwright: note: 20 symbolic links not followed: 20 lead to what was already read \(web\/p\/to-q, web\/p\/to-r, web\/p\/to-s, 17 more\)\n$/,
    );
  });

  it('a broken link named like a note is a file that cannot be read: exit 2', () => {
    const root = mkdtempSync(join(tmpdir(), 'ionwright-broken-'));
    writeFileSync(join(root, 'a.md'), NOTE);
    symlinkSync('moved-away.md', join(root, 'today.md'));
    const r = cli(['check', '.'], root);
    expect(r.status).toBe(2);
    expect(r.stderr).toBe('ionwright: today.md: cannot be read: a symbolic link that leads nowhere\n');
  });
});

describe('files that are not checked say why', () => {
  const dir = mkdtempSync(join(tmpdir(), 'ionwright-bytes-'));
  writeFileSync(join(dir, 'good.md'), NOTE);
  writeFileSync(join(dir, 'binary.md'), Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0x00, 0x00]));
  writeFileSync(join(dir, 'latin1.md'), Buffer.concat([Buffer.from('line one\nKaliumchlorid f'), Buffer.from([0xfc]), Buffer.from('r `KCl`\n')]));
  writeFileSync(join(dir, 'utf16.fnote'), Buffer.from('\ufeffformula: KCl\n', 'utf16le'));
  writeFileSync(join(dir, 'nul.md'), 'Text `NaCl` then\n\u0000 a NUL\n');

  it('binary, not UTF-8, UTF-16: one line each with the reason and the place; exit 2; the rest checked', () => {
    for (const format of ['text', 'json', 'sarif']) {
      const r = cli(['check', '.', '--format', format], dir);
      expect(r.status).toBe(2);
      expect(r.stderr.split('\n').filter(Boolean)).toEqual([
        'ionwright: binary.md: skipped: binary (NUL byte at offset 8, line 3)',
        'ionwright: latin1.md: skipped: not UTF-8 text (invalid byte 0xFC at offset 24, line 2)',
        'ionwright: nul.md: skipped: binary (NUL byte at offset 17, line 2)',
        'ionwright: utf16.fnote: skipped: UTF-16 text (byte-order mark 0xFF 0xFE); save it as UTF-8',
      ]);
      if (format === 'json') expect(new Set((JSON.parse(r.stdout) as Array<{ file: string }>).map((d) => d.file))).toEqual(new Set(['good.md']));
      if (format === 'sarif') {
        const inv = JSON.parse(r.stdout).runs[0].invocations[0];
        expect(inv.executionSuccessful).toBe(false);
        expect(inv.toolExecutionNotifications.map((n: { message: { text: string } }) => n.message.text)[2]).toBe(
          'skipped: binary (NUL byte at offset 17, line 2)',
        );
      }
      if (format === 'text') expect(r.stdout).toMatch(/^1 file checked: 1 error, 0 warnings\.$/m);
    }
  });

  it('batch and table say the same and exit 2', () => {
    for (const command of ['batch', 'table']) {
      const r = cli([command, '.'], dir);
      expect(r.status).toBe(2);
      expect(r.stderr).toContain('ionwright: latin1.md: skipped: not UTF-8 text (invalid byte 0xFC at offset 24, line 2)\n');
      expect(r.stdout).toContain('════ good.md');
    }
  });

  it.skipIf(process.getuid?.() === 0)('a file without read permission: cannot be read: permission denied (EACCES)', () => {
    const locked = mkdtempSync(join(tmpdir(), 'ionwright-locked-'));
    writeFileSync(join(locked, 'secret.md'), NOTE);
    chmodSync(join(locked, 'secret.md'), 0o000);
    const r = cli(['check', '.'], locked);
    expect(r.status).toBe(2);
    expect(r.stderr).toBe('ionwright: secret.md: cannot be read: permission denied (EACCES)\n');
  });

  it('the reason of a failed read comes from its error code, in words (as root, read permission cannot be taken away: an IO in memory)', async () => {
    const denied = Object.assign(new Error("EACCES: permission denied, open '/notes/b.md'"), { code: 'EACCES' });
    expect(reasonOf(denied)).toBe('permission denied (EACCES)');
    expect(reasonOf(Object.assign(new Error('EIO: i/o error, read'), { code: 'EIO' }))).toBe('i/o error (EIO)');
    let err = '';
    const io: CliIO = {
      cwd: '/',
      out: () => undefined,
      err: (t) => void (err += t + '\n'),
      readFile: (p) => {
        if (p === '/notes/b.md') throw denied;
        return 'formula: KCl';
      },
      readDir: () => ['a.md', 'b.md'],
      isDirectory: (p) => p === '/notes',
    };
    expect(await run(['check', '/notes'], io)).toBe(2);
    expect(err).toBe('ionwright: notes/b.md: cannot be read: permission denied (EACCES)\n');
  });
});

describe('decoding a notes file', () => {
  it('finds the first byte that is not UTF-8 where Node and the WHATWG decoder do', () => {
    // Outside references: Node's buffer.isUtf8 (simdutf) for valid or not, and TextDecoder (the WHATWG
    // Encoding Standard's UTF-8 decoder) for where the first replacement character appears.
    const bytes = fc.oneof(
      fc.uint8Array({ maxLength: 40 }),
      fc
        .array(
          fc.oneof(
            fc.string({ unit: 'binary', maxLength: 6 }).map((s) => [...Buffer.from(s, 'utf8')]),
            fc.array(fc.integer({ min: 0x80, max: 0xff }), { maxLength: 3 }),
          ),
          { maxLength: 8 },
        )
        .map((parts) => Uint8Array.from(parts.flat())),
    );
    const decoder = new TextDecoder('utf-8');
    fc.assert(
      fc.property(bytes, (b) => {
        const at = firstInvalidUtf8(b);
        expect(at === -1).toBe(isUtf8(b));
        if (at >= 0) {
          const prefix = decoder.decode(b.subarray(0, at));
          expect(prefix.includes('\ufffd')).toBe(false);
          expect(decoder.decode(b).startsWith(prefix + '\ufffd')).toBe(true);
        }
      }),
      { numRuns: 3000 },
    );
  });

  it('says why a file is not read: UTF-16, NUL bytes, invalid UTF-8 (with offset and line), and reads UTF-8 with a BOM without the mark', () => {
    expect(() => decodeNote(Buffer.from([0xfe, 0xff, 0, 0x41]))).toThrow('skipped: UTF-16 text (byte-order mark 0xFE 0xFF); save it as UTF-8');
    expect(() => decodeNote(Buffer.from('a\nb\nc\u0000'))).toThrow('skipped: binary (NUL byte at offset 5, line 3)');
    expect(() => decodeNote(Buffer.from([0x61, 0x0a, 0xed, 0xa0, 0x80]))).toThrow('skipped: not UTF-8 text (invalid byte 0xED at offset 2, line 2)'); // an encoded surrogate
    expect(() => decodeNote(Buffer.from([0xc0, 0xaf]))).toThrow('invalid byte 0xC0 at offset 0'); // an overlong '/'
    expect(decodeNote(Buffer.from('\ufeffFe₂O₃ 🧪', 'utf8'))).toBe('Fe₂O₃ 🧪');
  });
});

describe('a UTF-8 byte-order mark', () => {
  it('is not part of the note: columns on the first line are those an editor shows', () => {
    const bytes = new Uint8Array([0xef, 0xbb, 0xbf, ...new TextEncoder().encode('Use `NaXx`.\n')]);
    const text = decodeNote(bytes);
    expect(text.startsWith('Use')).toBe(true);
    expect(text.indexOf('Xx')).toBe(7);
  });
});
