/*
 * Reference timing only (npm run bench -- qmc): a plain single-thread C implementation of
 * stochastic series expansion for the transverse-field Ising chain
 *   H = -J sum_i (s^z_i s^z_{i+1} + 1) - h sum_i (s^x_i + 1)   (ferromagnetic gauge of the
 * repulsive chain at mu = V1, J = V1/4, h = alpha), diagonal update plus multibranch cluster
 * update (A. W. Sandvik, Phys. Rev. E 68, 056701 (2003)). Written for this benchmark; it
 * measures what native code does per operator slot on this machine, side by side with the
 * TypeScript engine. Usage: tfim-chain-sse N beta J h sweeps seed -> "sweeps seconds L n".
 */
#include <stdio.h>
#include <stdlib.h>
#include <stdint.h>
#include <string.h>
#include <time.h>

static uint64_t s0 = 88172645463325252ULL;
static double rnd(void) { /* xorshift64* */
  s0 ^= s0 >> 12; s0 ^= s0 << 25; s0 ^= s0 >> 27;
  return (double)((s0 * 2685821657736338717ULL) >> 11) * (1.0 / 9007199254740992.0);
}

int main(int argc, char **argv) {
  if (argc < 7) return 2;
  int N = atoi(argv[1]); double beta = atof(argv[2]), J = atof(argv[3]), h = atof(argv[4]);
  int sweeps = atoi(argv[5]); s0 ^= (uint64_t)atoll(argv[6]) * 0x9E3779B97F4A7C15ULL;
  /* op[p]: 0 empty; 2i+? encoding: site ops type 1 const, 2 flip; bonds type 3. */
  int L = 64, n = 0;
  int *type = calloc(L, sizeof(int)), *site = calloc(L, sizeof(int));
  int *link = NULL, *first = malloc(N * sizeof(int)), *last = malloc(N * sizeof(int));
  char *spin = malloc(N), *vis = NULL; int *queue = NULL, cap = 0;
  for (int i = 0; i < N; i++) spin[i] = rnd() < 0.5;
  double Wtot = N * h + N * 2 * J;
  clock_t t0 = 0; int measured = 0;
  for (int sw = 0; sw < sweeps; sw++) {
    if (sw == sweeps / 5) t0 = clock();
    /* diagonal update */
    for (int p = 0; p < L; p++) {
      int t = type[p];
      if (t == 2) { spin[site[p]] ^= 1; continue; }
      if (t == 0) {
        if (rnd() * (L - n) < beta * Wtot) {
          double r = rnd() * Wtot;
          if (r < N * h) { type[p] = 1; site[p] = (int)(r / h); n++; }
          else { int b = (int)(rnd() * N); if (spin[b] == spin[(b + 1) % N]) { type[p] = 3; site[p] = b; n++; } }
        }
      } else if (rnd() * beta * Wtot < L - n + 1) { type[p] = 0; n--; }
    }
    /* links */
    if (cap < 4 * L) { cap = 4 * L; link = realloc(link, cap * sizeof(int)); vis = realloc(vis, cap); queue = realloc(queue, cap * sizeof(int)); }
    for (int i = 0; i < N; i++) first[i] = last[i] = -1;
    for (int p = 0; p < L; p++) {
      int t = type[p]; if (!t) continue;
      int nl = t == 3 ? 2 : 1;
      for (int a = 0; a < nl; a++) {
        int i = t == 3 ? (site[p] + a) % N : site[p], below = 4 * p + a, above = 4 * p + 2 + a;
        if (last[i] >= 0) { link[last[i]] = below; link[below] = last[i]; } else first[i] = below;
        last[i] = above;
      }
    }
    for (int i = 0; i < N; i++) if (first[i] >= 0) { link[first[i]] = last[i]; link[last[i]] = first[i]; }
    /* multibranch clusters: flip each with probability 1/2 (symmetric weights) */
    memset(vis, 0, 4 * L);
    for (int v0 = 0; v0 < 4 * L; v0++) {
      int t = type[v0 >> 2];
      if (vis[v0] || !t || (t != 3 && (v0 & 1))) continue;
      int flip = rnd() < 0.5, head = 0, tail = 0;
      queue[tail++] = v0;
      if (t == 3) { int b = v0 & ~3; for (int l = 0; l < 4; l++) { vis[b + l] = 1; if (b + l != v0) queue[tail++] = b + l; } } else vis[v0] = 1;
      while (head < tail) {
        int v = queue[head++], w = link[v];
        if (vis[w]) continue;
        int tw = type[w >> 2];
        if (tw == 3) { int b = w & ~3; for (int l = 0; l < 4; l++) { vis[b + l] = 1; queue[tail++] = b + l; } }
        else { vis[w] = 1; queue[tail++] = w; }
      }
      if (flip) for (int q = 0; q < tail; q++) { int p = queue[q] >> 2; vis[queue[q]] = 2; if (type[p] == 1) type[p] = 2; else if (type[p] == 2) type[p] = 1; }
    }
    /* the state at p = 0 flips where the cluster of a line's first leg flipped; free lines at random */
    for (int i = 0; i < N; i++) {
      if (first[i] < 0) { if (rnd() < 0.5) spin[i] ^= 1; }
      else if (vis[first[i]] == 2) spin[i] ^= 1;
    }
    if (sw < sweeps / 5 && 4 * n > 3 * L) {
      int L2 = n + n / 3 + 8;
      type = realloc(type, L2 * sizeof(int)); site = realloc(site, L2 * sizeof(int));
      for (int p = L; p < L2; p++) type[p] = site[p] = 0;
      L = L2;
    }
    if (sw >= sweeps / 5) measured++;
  }
  double sec = (double)(clock() - t0) / CLOCKS_PER_SEC;
  printf("%d %.6f %d %d\n", measured, sec, L, n);
  return 0;
}
