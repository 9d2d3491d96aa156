/**
 * The page's state as an export reads it: the address always carries the whole state
 * (the page writes every entry to it on each change, src/ui/state/url-codec.ts), so a
 * figure or table names its file and writes its header from it without being handed it.
 */
import type { AppState } from '../state/app-state.ts';
import { decodeState } from '../state/url-codec.ts';

/** The state the address holds now. */
export function pageState(): AppState {
  return decodeState(location.search);
}
