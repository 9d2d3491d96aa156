/**
 * The state in the URL: one query parameter per entry, model entries under their flag
 * names (lattice=chain&rb=1.5&...), the other sections as section.key (atlas.x=mu=-1:2.9:64).
 * Every entry is written, so a link means the same thing even if the defaults change.
 * Unknown parameters are ignored and missing ones take the demo value.
 */
import { type AppState, MODEL_KEYS, type SectionName, VIEWS, type ViewName, demoState } from './app-state.ts';

const SECTIONS: SectionName[] = ['atlas', 'staircase', 'modes', 'correlated', 'planner', 'lab'];

/** State -> query string (without the leading "?"). */
export function encodeState(s: AppState): string {
  const q = new URLSearchParams();
  q.set('view', s.view);
  for (const k of MODEL_KEYS) q.set(k, s.model[k]);
  for (const sec of SECTIONS) {
    for (const [k, v] of Object.entries(s[sec])) q.set(`${sec}.${k}`, v as string);
  }
  return q.toString();
}

/** Query string -> state; `base` supplies whatever the query leaves out. */
export function decodeState(query: string, base: AppState = demoState()): AppState {
  const q = new URLSearchParams(query.startsWith('?') ? query.slice(1) : query);
  const s = JSON.parse(JSON.stringify(base)) as AppState;
  const view = q.get('view');
  if (view && (VIEWS as readonly string[]).includes(view)) s.view = view as ViewName;
  for (const k of MODEL_KEYS) {
    const v = q.get(k);
    if (v !== null) s.model[k] = v;
  }
  for (const sec of SECTIONS) {
    const section = s[sec] as Record<string, string>;
    for (const k of Object.keys(section)) {
      const v = q.get(`${sec}.${k}`);
      if (v !== null) section[k] = v;
    }
  }
  return s;
}

/** True when the query carries any state at all (a shared link, not a bare address). */
export function queryHasState(query: string): boolean {
  const q = new URLSearchParams(query.startsWith('?') ? query.slice(1) : query);
  return q.has('view') || MODEL_KEYS.some((k) => q.has(k));
}
