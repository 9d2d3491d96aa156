/**
 * Styles shared by every element of the page (each element has its own shadow root, so
 * the common look of controls is adopted, not inherited). Ink on paper, one accent (the
 * figures' indigo, plot/house-style.ts); text contrast at least 7:1 on the page background,
 * controls at least 4.5:1 (tests/ui/plot/palette-vision.test.ts).
 */
import { css } from 'lit';

export const sharedStyles = css`
  :host { --ink: #1d2430; --muted: #4a5363; --paper: #fbfaf7; --panel: #ffffff; --line: #c9cfd9;
    --accent: #3a3f9e; --accent-ink: #ffffff; --warn: #8a2b0f; --warn-bg: #fdf0ea; --ok: #1f6b3a;
    color: var(--ink); font-family: 'IBM Plex Sans', 'Source Sans 3', 'Segoe UI', 'DejaVu Sans', Verdana, sans-serif; font-size: 14px; }
  *, *::before, *::after { box-sizing: border-box; }
  button, select, input, textarea { font: inherit; color: inherit; }
  button { background: var(--panel); border: 1px solid #7d8798; border-radius: 4px; padding: 4px 10px; cursor: pointer; }
  button:hover { background: #eef2f6; }
  button.primary { background: var(--accent); color: var(--accent-ink); border-color: var(--accent); }
  button.primary:hover { background: #2c3080; }
  button:disabled { opacity: 0.55; cursor: default; }
  :focus-visible { outline: 3px solid #d9a21b; outline-offset: 1px; }
  input, select, textarea { background: var(--panel); border: 1px solid #7d8798; border-radius: 4px; padding: 3px 6px; }
  input[aria-invalid='true'] { border-color: var(--warn); background: var(--warn-bg); }
  .err { color: var(--warn); font-size: 12.5px; }
  .range-note { font-size: 12.5px; max-width: 34em; }
  .muted { color: var(--muted); }
  .row { display: flex; gap: 8px; align-items: center; flex-wrap: wrap; }
  .note { border-left: 4px solid #b9893a; background: #fbf5e8; padding: 6px 10px; margin: 8px 0; font-size: 13px; }
  .caution { border-left: 4px solid var(--warn); background: var(--warn-bg); padding: 6px 10px; margin: 8px 0; font-size: 13px; }
  table { border-collapse: collapse; font-size: 13px; }
  th, td { border-bottom: 1px solid #e1e5eb; padding: 3px 8px; text-align: right; }
  th { text-align: right; font-weight: 600; background: #f1f3f6; }
  td.l, th.l { text-align: left; }
  h2 { font-size: 17px; margin: 4px 0 8px; }
  h3 { font-size: 15px; margin: 10px 0 6px; }
  .sr-only { position: absolute; width: 1px; height: 1px; overflow: hidden; clip: rect(0 0 0 0); white-space: nowrap; }
`;
