/**
 * What a slot of the operator string holds: nothing, a constant site operator alpha, a flip
 * operator alpha sigma^x, a diagonal bond or a diagonal field operator (sse-terms.ts).
 * Constant and flip operators trade places in the off-diagonal updates.
 */
export const SLOT = { EMPTY: 0, CONST: 1, FLIP: 2, BOND: 3, FIELD: 4 } as const;
