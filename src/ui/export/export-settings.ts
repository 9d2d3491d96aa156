/**
 * The figure size chosen for exports, one setting for every figure of the page (a paper's
 * figures share a column width), kept in localStorage beside the session and announced
 * to every figure panel when it changes.
 */
import { DEFAULT_SIZE, DPI_CHOICES, type FigureSize, type SizePreset } from './figure-size.ts';

const KEY = 'blockade-atlas.export-size.v1';
const PRESETS: SizePreset[] = ['screen', 'single', 'double', 'custom'];
const changes = new EventTarget();

/** The setting as stored, or the default when none (or a bad one) is stored. */
export function loadFigureSize(): FigureSize {
  try {
    const s = JSON.parse(localStorage.getItem(KEY) ?? 'null') as Partial<FigureSize> | null;
    if (s && PRESETS.includes(s.preset as SizePreset) && (DPI_CHOICES as readonly number[]).includes(s.dpi as number)
      && typeof s.inches === 'number' && s.inches > 0) return { preset: s.preset as SizePreset, inches: s.inches, dpi: s.dpi as number };
  } catch { /* storage disabled or damaged: the default */ }
  return { ...DEFAULT_SIZE };
}

/** Store the setting and tell every listener. */
export function saveFigureSize(s: FigureSize): void {
  try { localStorage.setItem(KEY, JSON.stringify(s)); } catch { /* private mode: this page keeps it */ }
  changes.dispatchEvent(new Event('change'));
}

/** Call `f` on every change; returns the unsubscribe function. */
export function onFigureSizeChange(f: () => void): () => void {
  changes.addEventListener('change', f);
  return () => changes.removeEventListener('change', f);
}
