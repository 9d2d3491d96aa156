/**
 * File names of exports that say what they hold: the view, the figure or table, and the
 * key inputs, e.g. `atlas-phase-map_chain_vdw_delta3_mu-1..2.9_Rb0.8..2.4_T0.svg`.
 * A parameter a scan axis sets is replaced, in its own place, by the axis range
 * `name<start>..<stop>`; the other parameters carry their value as typed. Names keep to
 * the characters every file system takes ([A-Za-z0-9._-]); anything else becomes '-'.
 */
import type { AppState, ModelInputs } from '../state/app-state.ts';
import { parseRange } from '../../core/scan/axes.ts';

/** Longest base name written (file systems take 255 bytes; the extension and room for a browser's " (1)"). */
export const MAX_BASE_LENGTH = 160;

/** Short tags of the model entries in file names. */
const TAG: Record<string, string> = {
  rb: 'Rb', v1: 'V1', v2: 'V2', v0: 'V0', rc: 'Rc', detuning: 'delta', mu: 'mu', density: 'rho', temperature: 'T',
};

/** Which slot of the name an axis fills (an axis over rb fills the strength's place, ...). */
const SLOT_OF_AXIS: Record<string, string> = {
  rb: 'strength', v1: 'strength', mu: 'pump', density: 'pump', detuning: 'detuning', temperature: 'temperature',
};

/** One word of a file name: only [A-Za-z0-9._-], no run of '-', no leading or trailing '-' or '.'. */
export function safeWord(text: string): string {
  return text.trim().replace(/\u2212/g, '-').replace(/\s+/g, '-').replace(/[^A-Za-z0-9._-]+/g, '-')
    .replace(/-{2,}/g, '-').replace(/^[-.]+|[-.]+$/g, '');
}

/** A value as typed, made file-safe ('1e-3' and a leading '-' stay, a Unicode minus becomes '-'). */
function value(text: string): string {
  return text.trim().replace(/\u2212/g, '-').replace(/[^A-Za-z0-9._-]+/g, '-');
}

/**
 * An axis as `tag<start>..<stop>` from its entry `name=range` (or the bare range of
 * `name`): read by the scan's own range parser, the text itself when that refuses it.
 */
export function axisWord(entry: string, name?: string): { name: string; word: string } {
  const at = entry.indexOf('=');
  const axis = (name ?? (at >= 0 ? entry.slice(0, at) : '')).trim();
  const range = name !== undefined || at < 0 ? entry : entry.slice(at + 1);
  let span: string;
  try {
    const r = parseRange(range.trim(), axis || 'range');
    span = r.count === 1 ? String(r.start) : `${r.start}..${r.stop}`;
  } catch {
    span = range;
  }
  return { name: axis, word: `${TAG[axis] ?? axis}${value(span)}` };
}

/** The model words in a fixed order; axes replace the entries they set, in their slot. */
export function modelWords(m: ModelInputs, axes: { name: string; word: string }[] = []): string[] {
  const slot = new Map<string, string[]>();
  for (const a of axes) {
    const s = SLOT_OF_AXIS[a.name] ?? 'extra';
    slot.set(s, [...(slot.get(s) ?? []), a.word]);
  }
  const fixed = (k: keyof ModelInputs) => (m[k].trim() === '' ? [] : [`${TAG[k] ?? k}${value(m[k])}`]);
  let strength: string[];
  if (m.interaction === 'nn') strength = [...fixed('v1'), ...(Number(m.v2) ? fixed('v2') : [])];
  else if (m.interaction === 'softcore') strength = [...fixed('v0'), ...fixed('rc')];
  else strength = fixed(m.strength === 'v1' ? 'v1' : 'rb');
  const words = [value(m.lattice), value(m.interaction)];
  words.push(...(slot.get('strength') ?? strength));
  words.push(...(slot.get('detuning') ?? fixed('detuning')));
  words.push(...(slot.get('pump') ?? fixed(m.pump === 'density' ? 'density' : 'mu')));
  words.push(...(slot.get('temperature') ?? fixed('temperature')));
  words.push(...(slot.get('extra') ?? []));
  return words.filter((w) => w !== '');
}

/** Figures and tables that belong to the atlas' opened point rather than to the whole map. */
const POINT_ITEMS = new Set(['sublattice-pattern', 'branches', 'point', 'point-spectrum']);

/**
 * The base name (no extension) of an export of `item` (a figure's or table's name) from
 * the page in state `s`: `<view>[-<item>]_<model words>[_<view words>]`.
 */
export function exportBaseName(s: AppState, item: string): string {
  const view = s.view;
  const head = safeWord(item) && safeWord(item) !== view ? `${view}-${safeWord(item)}` : view;
  let axes: { name: string; word: string }[] = [];
  const tail: string[] = [];
  if (view === 'atlas') {
    axes = [s.atlas.x, s.atlas.y].filter((e) => e.trim() !== '').map((e) => axisWord(e));
    // the opened point is one model point: the axes' values stand in their slots
    if (POINT_ITEMS.has(item) && s.atlas.point) return finish(head, modelWordsAt(s, ...s.atlas.point.split(',')));
  } else if (view === 'staircase') {
    axes = [axisWord(s.staircase.mu, 'mu')];
  } else if (view === 'correlated') {
    const c = s.correlated;
    tail.push(value(c.method), `${value(c.cluster)}${c.cluster === 'array' ? '' : value(c.size)}`);
    if (c.alpha.trim()) tail.push(`alpha${value(c.alpha)}`);
  }
  return finish(head, [...modelWords(s.model, axes), ...tail]);
}

/** The model words at the atlas' opened point: the two axes' values in their slots. */
function modelWordsAt(s: AppState, ...xy: (string | undefined)[]): string[] {
  const names = [s.atlas.x, s.atlas.y].map((e) => e.slice(0, Math.max(0, e.indexOf('='))).trim());
  const at = xy.slice(0, 2).map((v, i) => ({ name: names[i], word: `${TAG[names[i]] ?? names[i]}${value(v ?? '')}` }))
    .filter((a) => a.name !== '');
  return modelWords(s.model, at);
}

/** Join the words and keep the whole within MAX_BASE_LENGTH. */
function finish(head: string, words: string[]): string {
  const name = [head, ...words.map(safeWord).filter((w) => w !== '')].join('_');
  return name.length > MAX_BASE_LENGTH ? name.slice(0, MAX_BASE_LENGTH).replace(/[-._]+$/, '') : name;
}
