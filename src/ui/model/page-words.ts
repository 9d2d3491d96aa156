/**
 * Messages in the page's words. The core's refusals are written once for both the CLI and
 * the page and name entries by their command-line flags (`--rb`, `--x`) or by plain symbol
 * names (`mu`, `rb axis`); on the page they are turned into the names the form shows
 * (blockade radius Rb, horizontal axis, mu as a symbol). The numbers are never touched.
 */

/** Flag -> the page's name of the entry. */
const FLAGS: Record<string, string> = {
  x: 'the horizontal axis', y: 'the vertical axis', rb: 'the blockade radius Rb', v1: 'V1', v2: 'V2', v0: 'the plateau height V0',
  rc: 'the core radius Rc', mu: 'the chemical potential \u03bc', density: 'the excitation density \u03c1', detuning: 'the detuning \u03b4',
  temperature: 'the temperature T', 'max-cell': 'Mmax (largest pattern)', cell: 'the cell size M', lattice: 'the lattice',
  interaction: 'the interaction shape', range: 'the range cut', sizes: 'the cluster sizes', ground: 'the ground-state box',
  sites: 'an uploaded array', alpha: 'a fixed \u03b1', 'alpha-points': 'the \u03b1 grid points', sweeps: 'the sweeps', chains: 'the chains',
  seed: 'the seed', points: 'the path points', size: 'the cluster size',
};

/** Words of the core -> the page's words (whole words only). */
const WORDS: [RegExp, string][] = [
  [/\bthe rb axis\b/g, 'the blockade-radius (Rb) axis'],
  [/\bthe v1 axis\b/g, 'the V1 axis'],
  [/\brb\b/g, 'Rb'],
  [/\bv([012])\b/g, 'V$1'],
  [/\brc\b/g, 'Rc'],
  [/\bmax-cell\b/g, 'Mmax'],
  [/^range must/, 'the range cut must'],
  [/\bvdw\b/g, 'van der Waals'],
  [/\bsoftcore\b/g, 'soft core'],
  [/\bnn\b/g, 'nearest-neighbour'],
  [/\bmu\b/g, '\u03bc'],
  [/\brho\b/g, '\u03c1'],
  [/\bdelta\b/g, '\u03b4'],
  [/\balpha\b/g, '\u03b1'],
  [/\bkappa\b/g, '\u03ba'],
  [/\bgamma\b/g, '\u03b3'],
  [/\brmax\b/g, 'the range cut rmax'],
];

/** The message with flags and the core's bare names replaced by the page's words. */
export function inPageWords(message: string): string {
  let s = message.replace(/(^|[\s(])--([a-z][a-z0-9-]*)/g, (m, pre: string, flag: string) => (flag in FLAGS ? pre + FLAGS[flag] : m));
  for (const [re, w] of WORDS) s = s.replace(re, w);
  return s;
}
