/**
 * Term tooltips: a word of the trade on the page, dotted underlined, with its meaning in
 * its title (shown on hover, and read as its description by screen readers; the word is
 * focusable so keyboard users reach it). Definitions in our words, in the conventions of
 * DESIGN.md (energies in g, lengths in a).
 */
import { html, css, type TemplateResult } from 'lit';

export const TERMS = {
  supersolid: 'Supersolid: both orders at once. The cavity photon is condensed (\u03b1 \u2260 0) and the emitter densities form a pattern '
    + 'that repeats only every M sites. Its density is not locked: the pattern\u2019s period p/q is not a filling.',
  margin: 'Stability margin: the lowest eigenvalue of the static stability matrix (the curvature of the mean-field grand potential) '
    + 'over the zone, scaled so free emitters give 1. It reaches 0 on a soft-mode line; below 0 a state of lower \u03a9 exists in the cell of k*.',
  'photon weight': 'Photon weight of a mode at k = 0: the share of its quanta carried by the cavity photon, from 0 (emitters only) '
    + 'to 1 (photon only). Away from k = 0 the photon does not take part, so the weight is 0 there.',
  Mmax: 'Mmax: the largest number of sublattices (sites in the repeating cell) the ground-state search tries. '
    + 'Patterns with a longer period cannot be found; a state that uses M = Mmax may be an artefact of that limit.',
  'range cut': 'Range cut rmax: pairs of emitters farther apart than rmax (in lattice spacings a) are left out of the interaction. '
    + 'Empty means the full lattice sum, converged. Comparing cuts shows what the long-range tail does.',
} as const;

export type Term = keyof typeof TERMS;

/** `text` (default: the term itself) marked as a term with its definition on hover and focus. */
export function term(key: Term, text: string | TemplateResult = key): TemplateResult {
  return html`<span class="term" data-term=${key} title=${TERMS[key]} tabindex="0">${text}</span>`;
}

/** The look of a term: dotted underline, help cursor. Add to an element's styles. */
export const termStyles = css`
  .term { text-decoration: underline dotted #4a5363; text-underline-offset: 2px; cursor: help; }
`;
