/**
 * The page's state as an export reads it: the address always carries the whole state
 * (the page writes every entry to it on each change, src/ui/state/url-codec.ts), so a
 * figure or table names its file and writes its header from it without being handed it.
 */
import type { AppState } from '../state/app-state.ts';
import { decodeState } from '../state/url-codec.ts';
import { commentLine, inputHeader } from './csv-header.ts';

/** The state the address holds now. */
export function pageState(): AppState {
  return decodeState(location.search);
}

/** The '#' comment header of every input of the page's state, as a CSV file's first lines (csv-header.ts). */
export function pageCsvHeader(item: string, command?: string): string {
  return inputHeader(pageState(), item, { command, written: new Date() }).map(commentLine).join('\n') + '\n';
}
