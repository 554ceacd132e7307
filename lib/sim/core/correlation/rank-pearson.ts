/**
 * Between Spearman's rank correlation ρ and the Pearson correlation r of a bivariate normal
 * (Pearson 1907; Kruskal 1958, JASA 53:814–861, §2.4):
 *
 *   ρ = (6/π) · arcsin(r/2)      r = 2 · sin(π ρ / 6)
 *
 * The engine induces rank correlation through normal scores, so a target ρ becomes r on the
 * normal scale and back again when it reports what it used.
 */

export const spearmanToPearson = (rho: number): number => 2 * Math.sin((Math.PI * rho) / 6);

export const pearsonToSpearman = (r: number): number =>
  (6 / Math.PI) * Math.asin(Math.max(-1, Math.min(1, r / 2)));
