/**
 * Walker's alias method: draw index t with probability w_t / sum w in O(1) after an O(T)
 * build (A. J. Walker, ACM Trans. Math. Softw. 3, 253 (1977); the two-list construction of
 * Vose, IEEE Trans. Softw. Eng. 17, 972 (1991)). A draw takes one uniform deviate u:
 * t = floor(u T), keep t if the fractional part is below prob[t], else take alias[t].
 */

export interface AliasTable {
  /** Number of outcomes T. */
  readonly size: number;
  /** Acceptance threshold of each column, in [0, 1]. */
  readonly prob: Float64Array;
  /** Outcome taken when column t rejects. */
  readonly alias: Int32Array;
  /** sum_t w_t. */
  readonly total: number;
}

/** Build the alias table of non-negative weights w (at least one positive). */
export function aliasTable(w: ArrayLike<number>): AliasTable {
  const T = w.length;
  let total = 0;
  for (let t = 0; t < T; t++) {
    if (!(w[t] >= 0) || !Number.isFinite(w[t])) throw new Error(`alias table: weight ${t} is ${w[t]}`);
    total += w[t];
  }
  if (!(total > 0)) throw new Error('alias table: all weights are zero');
  const prob = new Float64Array(T), alias = new Int32Array(T);
  const scaled = new Float64Array(T);
  const small = new Int32Array(T), large = new Int32Array(T);
  let ns = 0, nl = 0;
  for (let t = 0; t < T; t++) {
    scaled[t] = (w[t] * T) / total;
    alias[t] = t;
    if (scaled[t] < 1) small[ns++] = t; else large[nl++] = t;
  }
  while (ns > 0 && nl > 0) {
    const s = small[--ns], l = large[--nl];
    prob[s] = scaled[s];
    alias[s] = l;
    scaled[l] = scaled[l] + scaled[s] - 1;
    if (scaled[l] < 1) small[ns++] = l; else large[nl++] = l;
  }
  // What is left is 1 up to rounding.
  while (nl > 0) prob[large[--nl]] = 1;
  while (ns > 0) prob[small[--ns]] = 1;
  return { size: T, prob, alias, total };
}

/** One draw from the table with a uniform deviate u in [0, 1). */
export function aliasDraw(table: AliasTable, u: number): number {
  const x = u * table.size;
  const t = Math.floor(x);
  return x - t < table.prob[t] ? t : table.alias[t];
}
