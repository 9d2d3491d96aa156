/**
 * Sessions in localStorage: the last one, restored on reload when the address carries no
 * state of its own, and named ones the user saves, lists, loads and deletes. Each is kept
 * as the same query string the URL holds (url-codec.ts), so a session means what its link
 * means.
 *
 * Named sessions live under one key as
 *   { "format": "blockade-atlas-sessions",
 *     "entries": [ { "version": 1, "name": ..., "savedAt": ISO time, "query": ... }, ... ] }
 * An entry of another version (older pages wrote none), or whose fields are missing or not a page state,
 * is refused by name with the reason (and can still be deleted); a store that is not this
 * JSON at all is refused whole, and the next save starts a new one.
 */
import type { AppState } from './app-state.ts';
import { decodeState, encodeState, queryHasState } from './url-codec.ts';

const KEY = 'blockade-atlas.session.v1';
const NAMED_KEY = 'blockade-atlas.saved-sessions';
const FORMAT = 'blockade-atlas-sessions';
export const SESSIONS_VERSION = 1;
/** Longest name accepted (it is shown in a list). */
export const MAX_NAME = 80;

/** The storage used: the page's localStorage, or any object with the same three calls (tests). */
export type KeyValueStore = Pick<Storage, 'getItem' | 'setItem' | 'removeItem'>;

function local(): KeyValueStore | null {
  try { return globalThis.localStorage ?? null; } catch { return null; }
}

/** Save the state (storage may be full or disabled: then nothing is kept, silently). */
export function saveSession(s: AppState, store = local()): void {
  try { store?.setItem(KEY, encodeState(s)); } catch { /* private mode or quota: keep going */ }
}

/** The saved state, or null. */
export function loadSession(store = local()): AppState | null {
  try {
    const q = store?.getItem(KEY);
    return q && queryHasState(q) ? decodeState(q) : null;
  } catch {
    return null;
  }
}

/** Forget the saved session (the "reset to demo" button). */
export function clearSession(store = local()): void {
  try { store?.removeItem(KEY); } catch { /* nothing to clear */ }
}

/** A named session as listed. */
export interface SavedSession { name: string; savedAt: string; query: string }
/** An entry that cannot be read, and why. */
export interface RefusedSession { name: string; reason: string }

export interface SessionList {
  sessions: SavedSession[];
  refused: RefusedSession[];
  /** Set when the whole store is unreadable (then both lists are empty). */
  storeError?: string;
  /** The raw entries as stored (good and refused), kept so a save or delete leaves the others as they were. */
  raw: unknown[];
}

/** Check one stored entry: a SavedSession, or the reason it is refused. */
export function checkEntry(e: unknown): SavedSession | RefusedSession {
  const o = (typeof e === 'object' && e !== null ? e : {}) as Record<string, unknown>;
  const version = o.version;
  const name = typeof o.name === 'string' && o.name.trim() !== '' ? o.name : '(no name)';
  if (version !== SESSIONS_VERSION) return { name, reason: `saved by another version of the page (format version ${String(version)}, this page reads ${SESSIONS_VERSION})` };
  if (typeof o.name !== 'string' || o.name.trim() === '' || o.name.length > MAX_NAME) return { name, reason: 'the entry has no valid name' };
  if (typeof o.query !== 'string' || !queryHasState(o.query)) return { name, reason: 'the entry holds no page state' };
  if (typeof o.savedAt !== 'string' || Number.isNaN(Date.parse(o.savedAt))) return { name, reason: 'the entry has no valid save time' };
  return { name: o.name, savedAt: o.savedAt, query: o.query };
}

/** Parse the named-session store's text (null: nothing saved yet). */
export function parseSessionStore(text: string | null): SessionList {
  if (text === null) return { sessions: [], refused: [], raw: [] };
  let doc: unknown;
  try { doc = JSON.parse(text); } catch { return { sessions: [], refused: [], raw: [], storeError: 'the saved sessions are not readable (not JSON); saving a session starts a new list' }; }
  const d = (typeof doc === 'object' && doc !== null ? doc : {}) as Record<string, unknown>;
  if (d.format !== FORMAT || !Array.isArray(d.entries)) {
    return { sessions: [], refused: [], raw: [], storeError: 'the saved sessions are in an unknown format; saving a session starts a new list' };
  }
  const out: SessionList = { sessions: [], refused: [], raw: d.entries };
  for (const e of d.entries) {
    const c = checkEntry(e);
    if ('query' in c) out.sessions.push(c); else out.refused.push(c);
  }
  out.sessions.sort((a, b) => a.name.localeCompare(b.name));
  return out;
}

/** Every named session (and the refused entries, by name). */
export function listSessions(store = local()): SessionList {
  let text: string | null = null;
  try { text = store?.getItem(NAMED_KEY) ?? null; } catch { return { sessions: [], refused: [], raw: [], storeError: 'this browser does not allow saving (storage disabled)' }; }
  return parseSessionStore(text);
}

function write(raw: unknown[], store: KeyValueStore | null): void {
  if (!store) throw new Error('this browser does not allow saving (storage disabled)');
  try {
    store.setItem(NAMED_KEY, JSON.stringify({ format: FORMAT, entries: raw }));
  } catch {
    throw new Error('the browser refused to store the session (storage full or disabled)');
  }
}

const nameOf = (e: unknown) => (typeof e === 'object' && e !== null ? (e as { name?: unknown }).name : undefined);

/** Save the state under a name (replacing a session of the same name). Throws with a message for the page. */
export function saveNamedSession(name: string, s: AppState, store = local(), now = new Date()): void {
  const n = name.trim();
  if (n === '') throw new Error('give the session a name');
  if (n.length > MAX_NAME) throw new Error(`a session name has at most ${MAX_NAME} characters`);
  const list = listSessions(store);
  // the other entries (refused ones too) stay as stored; a same-named one is replaced
  const raw = list.raw.filter((e) => nameOf(e) !== n);
  raw.push({ version: SESSIONS_VERSION, name: n, savedAt: now.toISOString(), query: encodeState(s) });
  write(raw, store);
}

/** The state of a named session, or the reason it cannot be loaded. */
export function loadNamedSession(name: string, store = local()): { state: AppState } | { error: string } {
  const list = listSessions(store);
  if (list.storeError) return { error: list.storeError };
  const refused = list.refused.find((r) => r.name === name);
  if (refused) return { error: `"${name}" cannot be loaded: ${refused.reason}` };
  const hit = list.sessions.find((x) => x.name === name);
  if (!hit) return { error: `no saved session named "${name}"` };
  return { state: decodeState(hit.query) };
}

/** Delete a named session (a refused entry too). */
export function deleteNamedSession(name: string, store = local()): void {
  const list = listSessions(store);
  write(list.raw.filter((e) => nameOf(e) !== name && !(name === '(no name)' && typeof nameOf(e) !== 'string')), store);
}
