/**
 * Client logic without VS Code (command planning), the package.json contributions (every contributed
 * command is registered, every setting is read), and the debounced validator with a fake timer.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CLIENT_COMMANDS, planCommand, resultMessage, SERVER_COMMANDS } from '../../client/src/commands';
import { COMMANDS } from '../../server/src/server/server';
import { readSettings } from '../../server/src/service/config';
import { DebouncedValidator, type Timers } from '../../server/src/server/validator';

const pkg = JSON.parse(readFileSync(join(__dirname, '../../package.json'), 'utf8'));
// The commands are registered where both entries (desktop and browser) share the activation.
const extensionSource = readFileSync(join(__dirname, '../../client/src/activate.ts'), 'utf8');
const settingsSource = readFileSync(join(__dirname, '../../server/src/service/config.ts'), 'utf8');

describe('client commands', () => {
  const editor = { uri: 'file:///a.md', languageId: 'markdown', selection: { start: { line: 1, character: 2 }, end: { line: 3, character: 0 } } };
  it('plan the server command with the editor state', () => {
    expect(planCommand(CLIENT_COMMANDS.insertTable, editor)).toEqual({
      kind: 'server',
      command: SERVER_COMMANDS.insertTable,
      args: [{ uri: 'file:///a.md', range: editor.selection }],
    });
    expect(planCommand(CLIENT_COMMANDS.copyCard, editor)).toEqual({
      kind: 'server',
      command: SERVER_COMMANDS.cardMarkdown,
      args: [{ uri: 'file:///a.md', position: { line: 1, character: 2 } }],
    });
    expect(planCommand(CLIENT_COMMANDS.insertSectionTable, { ...editor, languageId: 'fnote' }).kind).toBe('server');
  });
  it('refuse politely outside notes files', () => {
    expect(planCommand(CLIENT_COMMANDS.insertTable, undefined)).toMatchObject({ kind: 'error' });
    expect(planCommand(CLIENT_COMMANDS.insertTable, { ...editor, languageId: 'python' })).toMatchObject({
      kind: 'error',
      message: expect.stringContaining('python'),
    });
  });
  it('say what happened', () => {
    expect(resultMessage(CLIENT_COMMANDS.copyCard, '**NaCl**')).toContain('copied');
    expect(resultMessage(CLIENT_COMMANDS.insertTable, { applied: false, reason: 'nothing to tabulate here' })).toContain('nothing to tabulate');
    expect(resultMessage(CLIENT_COMMANDS.insertTable, { applied: true })).toBeUndefined();
  });
  it('server command names are the same on both sides', () => {
    expect(SERVER_COMMANDS).toEqual(COMMANDS);
  });
});

describe('package.json contributions', () => {
  it('every contributed command is registered by the client, and every registered one is contributed', () => {
    const contributed = pkg.contributes.commands.map((c: { command: string }) => c.command).sort();
    const registered = [...extensionSource.matchAll(/registerCommand\(CLIENT_COMMANDS\.(\w+)/g)]
      .map((m) => CLIENT_COMMANDS[m[1] as keyof typeof CLIENT_COMMANDS])
      .sort();
    expect(registered).toEqual(contributed);
    for (const c of pkg.contributes.commands) expect(c.command.startsWith('ionwright.')).toBe(true);
  });
  it('every menu entry names a contributed command', () => {
    const contributed = new Set(pkg.contributes.commands.map((c: { command: string }) => c.command));
    for (const list of Object.values(pkg.contributes.menus) as Array<Array<{ command: string }>>)
      for (const m of list) expect(contributed.has(m.command), m.command).toBe(true);
  });
  it('every setting is read (server settings or the client trace) and has a default', () => {
    for (const [key, spec] of Object.entries(pkg.contributes.configuration.properties) as Array<[string, { default: unknown }]>) {
      expect(spec.default, key).not.toBeUndefined();
      if (key === 'ionwright.trace.server') continue; // read by vscode-languageclient itself
      const path = key.replace(/^ionwright\./, '').split('.');
      expect(settingsSource, `${key} is not read`).toContain(path[path.length - 1]);
    }
  });
  it('the defaults in package.json are the defaults the server uses', () => {
    const props = pkg.contributes.configuration.properties;
    const fromPkg: Record<string, any> = {};
    for (const [key, spec] of Object.entries(props) as Array<[string, { default: unknown }]>) {
      const path = key.replace(/^ionwright\./, '').split('.');
      let o = fromPkg;
      path.slice(0, -1).forEach((p) => (o = o[p] ??= {}));
      o[path[path.length - 1]] = spec.default;
    }
    expect(readSettings(fromPkg)).toEqual(readSettings(undefined));
  });
  it('has the entry points of the contract', () => {
    expect(pkg.main).toBe('./dist/extension.js');
    expect(pkg.bin.ionwright).toBe('dist/cli.js');
    expect(pkg.contributes.languages[0]).toMatchObject({ id: 'fnote', extensions: ['.fnote'] });
  });
});

describe('debounced validation', () => {
  class FakeTimers implements Timers {
    now = 0;
    queue: Array<{ at: number; fn: () => void; id: number }> = [];
    private next = 1;
    set(fn: () => void, ms: number) {
      const id = this.next++;
      this.queue.push({ at: this.now + ms, fn, id });
      return id;
    }
    clear(h: unknown) {
      this.queue = this.queue.filter((q) => q.id !== h);
    }
    advance(ms: number) {
      this.now += ms;
      const due = this.queue.filter((q) => q.at <= this.now);
      this.queue = this.queue.filter((q) => q.at > this.now);
      due.forEach((q) => q.fn());
    }
  }
  it('validates once after a burst of changes, after the delay', () => {
    const t = new FakeTimers();
    const runs: string[] = [];
    const v = new DebouncedValidator(t, (uri) => runs.push(uri));
    for (let i = 0; i < 10; i++) {
      v.schedule('a', 150);
      t.advance(50);
    }
    expect(runs).toEqual([]);
    t.advance(150);
    expect(runs).toEqual(['a']);
  });
  it('keeps documents apart, validates at once with no delay, and cancels on close', () => {
    const t = new FakeTimers();
    const runs: string[] = [];
    const v = new DebouncedValidator(t, (uri) => runs.push(uri));
    v.schedule('a', 100);
    v.schedule('b', 100);
    v.cancel('a');
    v.schedule('c', 0);
    t.advance(100);
    expect(runs).toEqual(['c', 'b']);
    expect(v.size).toBe(0);
  });
});
