/**
 * Reduction of a real square matrix to upper Hessenberg form by orthogonal similarity
 * (Householder reflections), H = Q^T A Q, accumulating Q in V:
 * the procedure orthes with its accumulation ortran (Martin and Wilkinson, Numer. Math. 12,
 * 349 (1968); Handbook for Automatic Computation II (1971), contribution II/13), as written
 * in JAMA and in ml-matrix 6.15 (MIT licence), from which this is translated. H and V are
 * ml-matrix matrices, overwritten.
 */
import type { Matrix } from 'ml-matrix';

/** H <- Q^T H Q upper Hessenberg, V <- Q; `ort` is workspace of length n. */
export function orthes(n: number, H: Matrix, ort: Float64Array, V: Matrix): void {
  const low = 0;
  const high = n - 1;
  let f: number, g: number, h: number, i: number, j: number, m: number;
  let scale;

  for (m = low + 1; m <= high - 1; m++) {
    scale = 0;
    for (i = m; i <= high; i++) {
      scale = scale + Math.abs(H.get(i, m - 1));
    }

    if (scale !== 0) {
      h = 0;
      for (i = high; i >= m; i--) {
        ort[i] = H.get(i, m - 1) / scale;
        h += ort[i] * ort[i];
      }

      g = Math.sqrt(h);
      if (ort[m] > 0) {
        g = -g;
      }

      h = h - ort[m] * g;
      ort[m] = ort[m] - g;

      for (j = m; j < n; j++) {
        f = 0;
        for (i = high; i >= m; i--) {
          f += ort[i] * H.get(i, j);
        }

        f = f / h;
        for (i = m; i <= high; i++) {
          H.set(i, j, H.get(i, j) - f * ort[i]);
        }
      }

      for (i = 0; i <= high; i++) {
        f = 0;
        for (j = high; j >= m; j--) {
          f += ort[j] * H.get(i, j);
        }

        f = f / h;
        for (j = m; j <= high; j++) {
          H.set(i, j, H.get(i, j) - f * ort[j]);
        }
      }

      ort[m] = scale * ort[m];
      H.set(m, m - 1, scale * g);
    }
  }

  for (i = 0; i < n; i++) {
    for (j = 0; j < n; j++) {
      V.set(i, j, i === j ? 1 : 0);
    }
  }

  for (m = high - 1; m >= low + 1; m--) {
    if (H.get(m, m - 1) !== 0) {
      for (i = m + 1; i <= high; i++) {
        ort[i] = H.get(i, m - 1);
      }

      for (j = m; j <= high; j++) {
        g = 0;
        for (i = m; i <= high; i++) {
          g += ort[i] * V.get(i, j);
        }

        g = g / ort[m] / H.get(m, m - 1);
        for (i = m; i <= high; i++) {
          V.set(i, j, V.get(i, j) + g * ort[i]);
        }
      }
    }
  }
}
