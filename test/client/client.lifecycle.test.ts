/** When the client runs the language server: started by the first note, stopped a while after the last. */
import { describe, expect, it } from 'vitest';
import { ServerLifecycle, servesDocument, type OpenDocument } from '../../client/src/lifecycle';

function host() {
  const docs: OpenDocument[] = [];
  const timers = new Map<number, () => void>();
  let next = 1;
  const calls: string[] = [];
  return {
    docs,
    calls,
    fire: () => {
      const due = [...timers.values()];
      timers.clear();
      for (const f of due) f();
    },
    pendingTimers: () => timers.size,
    host: {
      start: async () => void calls.push('start'),
      stop: async () => void calls.push('stop'),
      openDocuments: () => docs,
      setTimer: (fn: () => void) => (timers.set(next, fn), next++),
      clearTimer: (h: unknown) => void timers.delete(h as number),
      log: () => {},
    },
  };
}
const md = (scheme = 'file'): OpenDocument => ({ languageId: 'markdown', uri: { scheme } });

describe('the server lifecycle in the client', () => {
  it('does not start while no note is open (activation alone starts nothing)', async () => {
    const h = host();
    const l = new ServerLifecycle(h.host);
    h.docs.push({ languageId: 'python', uri: { scheme: 'file' } }, md('output'));
    await l.update();
    expect(h.calls).toEqual([]);
  });

  it('starts with the first note, once, and stops only after the delay once none is open', async () => {
    const h = host();
    const l = new ServerLifecycle(h.host);
    h.docs.push(md());
    await l.update();
    await l.update();
    expect(h.calls).toEqual(['start']);
    h.docs.length = 0;
    await l.update();
    expect(h.calls).toEqual(['start']);
    expect(h.pendingTimers()).toBe(1);
    h.fire();
    await l.update();
    expect(h.calls).toEqual(['start', 'stop']);
    expect(l.isRunning).toBe(false);
  });

  it('a note opened again before the delay keeps the server running', async () => {
    const h = host();
    const l = new ServerLifecycle(h.host);
    h.docs.push(md('untitled'));
    await l.update();
    h.docs.length = 0;
    await l.update();
    h.docs.push({ languageId: 'fnote', uri: { scheme: 'vscode-vfs' } });
    await l.update();
    expect(h.pendingTimers()).toBe(0);
    h.fire();
    expect(h.calls).toEqual(['start']);
  });

  it('a command starts it when it is not running; dispose stops it', async () => {
    const h = host();
    const l = new ServerLifecycle(h.host);
    await l.ensureRunning();
    expect(l.isRunning).toBe(true);
    await l.dispose();
    expect(h.calls).toEqual(['start', 'stop']);
  });

  it('serves Markdown and .fnote notes of any scheme but the output and settings panes', () => {
    expect(servesDocument(md('file'))).toBe(true);
    expect(servesDocument(md('vscode-vfs'))).toBe(true);
    expect(servesDocument(md('output'))).toBe(false);
    expect(servesDocument({ languageId: 'markdown', uri: { scheme: 'file' }, isClosed: true })).toBe(false);
    expect(servesDocument({ languageId: 'plaintext', uri: { scheme: 'file' } })).toBe(false);
  });
});
