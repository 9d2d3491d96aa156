/**
 * The last session in localStorage, restored on reload when the address carries no
 * state of its own. Stored as the same query string the URL holds.
 */
import type { AppState } from './app-state.ts';
import { decodeState, encodeState } from './url-codec.ts';

const KEY = 'blockade-atlas.session.v1';

/** Save the state (storage may be full or disabled: then nothing is kept, silently). */
export function saveSession(s: AppState): void {
  try { localStorage.setItem(KEY, encodeState(s)); } catch { /* private mode or quota: keep going */ }
}

/** The saved state, or null. */
export function loadSession(): AppState | null {
  try {
    const q = localStorage.getItem(KEY);
    return q ? decodeState(q) : null;
  } catch {
    return null;
  }
}

/** Forget the saved session (the "reset to demo" button). */
export function clearSession(): void {
  try { localStorage.removeItem(KEY); } catch { /* nothing to clear */ }
}
