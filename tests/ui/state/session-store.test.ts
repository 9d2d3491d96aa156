/**
 * Named sessions in the browser's storage: a save then a load gives the state back
 * exactly (round-trip invariant, common practice, no source); damaged entries, entries of
 * another format version and an unreadable store are refused by name with a reason, never
 * loaded and never thrown; deleting removes one entry and leaves the rest as stored.
 */
import { describe, it, expect } from 'vitest';
import { demoState } from '../../../src/ui/state/app-state.ts';
import { encodeState } from '../../../src/ui/state/url-codec.ts';
import {
  type KeyValueStore, SESSIONS_VERSION, deleteNamedSession, listSessions, loadNamedSession, loadSession, saveNamedSession, saveSession,
} from '../../../src/ui/state/session-store.ts';

const NAMED_KEY = 'blockade-atlas.saved-sessions';

/** An in-memory stand-in for localStorage. */
function memoryStore(init: Record<string, string> = {}): KeyValueStore & { data: Map<string, string> } {
  const data = new Map(Object.entries(init));
  return {
    data,
    getItem: (k) => data.get(k) ?? null,
    setItem: (k, v) => { data.set(k, String(v)); },
    removeItem: (k) => { data.delete(k); },
  };
}

describe('named sessions', () => {
  it('round-trips a saved state, lists it, replaces a same-named save and deletes it', () => {
    const store = memoryStore();
    const s = demoState();
    s.view = 'staircase';
    s.model.rb = '1.75';
    s.lab.rb = '1.5'; s.lab.drb = '0.01';
    s.atlas.x = 'detuning=2:4:30';
    saveNamedSession('  vdw chain, Rb 1.75  ', s, store, new Date('2026-01-02T03:04:05Z'));
    const list = listSessions(store);
    expect(list.refused).toEqual([]);
    expect(list.sessions.map((x) => [x.name, x.savedAt])).toEqual([['vdw chain, Rb 1.75', '2026-01-02T03:04:05.000Z']]);
    const back = loadNamedSession('vdw chain, Rb 1.75', store);
    expect(back).toEqual({ state: s });
    // a second save under the same name replaces the first
    const t = demoState();
    t.model.detuning = '4';
    saveNamedSession('vdw chain, Rb 1.75', t, store);
    saveNamedSession('other', demoState(), store);
    expect(listSessions(store).sessions.map((x) => x.name)).toEqual(['other', 'vdw chain, Rb 1.75']);
    expect(loadNamedSession('vdw chain, Rb 1.75', store)).toEqual({ state: t });
    deleteNamedSession('vdw chain, Rb 1.75', store);
    expect(listSessions(store).sessions.map((x) => x.name)).toEqual(['other']);
    expect(loadNamedSession('vdw chain, Rb 1.75', store)).toEqual({ error: 'no saved session named "vdw chain, Rb 1.75"' });
  });

  it('refuses a blank or too long name', () => {
    const store = memoryStore();
    expect(() => saveNamedSession('   ', demoState(), store)).toThrow('give the session a name');
    expect(() => saveNamedSession('x'.repeat(81), demoState(), store)).toThrow('at most 80 characters');
    expect(store.data.size).toBe(0);
  });

  it('refuses damaged and other-version entries by name, keeps them through a save, and lets them be deleted', () => {
    const good = { version: SESSIONS_VERSION, name: 'good', savedAt: '2026-01-01T00:00:00Z', query: encodeState(demoState()) };
    const store = memoryStore({
      [NAMED_KEY]: JSON.stringify({
        format: 'blockade-atlas-sessions',
        entries: [
          good,
          { name: 'old', savedAt: '2025-01-01T00:00:00Z', query: encodeState(demoState()) },          // no version: an older page
          { version: SESSIONS_VERSION, name: 'no state', savedAt: '2026-01-01T00:00:00Z', query: 'foo=1' },
          { version: SESSIONS_VERSION, name: 'bad time', savedAt: 'yesterday', query: encodeState(demoState()) },
          { version: SESSIONS_VERSION, name: 42, query: 7 },
          'not an object',
        ],
      }),
    });
    const list = listSessions(store);
    expect(list.sessions.map((x) => x.name)).toEqual(['good']);
    expect(list.refused.map((r) => r.name)).toEqual(['old', 'no state', 'bad time', '(no name)', '(no name)']);
    expect(list.refused[0].reason).toBe(`saved by another version of the page (format version undefined, this page reads ${SESSIONS_VERSION})`);
    expect(list.refused[1].reason).toBe('the entry holds no page state');
    expect(list.refused[2].reason).toBe('the entry has no valid save time');
    const old = loadNamedSession('old', store);
    expect('error' in old && old.error).toBe(`"old" cannot be loaded: ${list.refused[0].reason}`);
    // saving another session leaves the refused entries as they were stored
    saveNamedSession('new', demoState(), store);
    const after = listSessions(store);
    expect(after.sessions.map((x) => x.name)).toEqual(['good', 'new']);
    expect(after.refused.map((r) => r.name)).toEqual(['old', 'no state', 'bad time', '(no name)', '(no name)']);
    deleteNamedSession('old', store);
    expect(listSessions(store).refused.map((r) => r.name)).toEqual(['no state', 'bad time', '(no name)', '(no name)']);
    expect(loadNamedSession('good', store)).toEqual({ state: demoState() });
  });

  it('refuses an unreadable store whole, and a save then starts a new list', () => {
    for (const text of ['{not json', JSON.stringify({ format: 'something else', entries: [] }), JSON.stringify([1, 2])]) {
      const store = memoryStore({ [NAMED_KEY]: text });
      const list = listSessions(store);
      expect(list.sessions).toEqual([]);
      expect(list.storeError).toMatch(/saving a session starts a new list$/);
      expect(loadNamedSession('anything', store)).toEqual({ error: list.storeError });
      saveNamedSession('fresh', demoState(), store);
      expect(listSessions(store).sessions.map((x) => x.name)).toEqual(['fresh']);
    }
  });

  it('the last session: saved and restored, a stored text without page state ignored', () => {
    const store = memoryStore();
    const s = demoState();
    s.model.mu = '0.5';
    saveSession(s, store);
    expect(loadSession(store)).toEqual(s);
    store.data.set('blockade-atlas.session.v1', 'garbage=1');
    expect(loadSession(store)).toBeNull();
  });
});
