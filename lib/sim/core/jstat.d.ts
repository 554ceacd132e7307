// Minimal declarations for the parts of jstat 1.9.6 that Outturn uses (the package ships no types).
declare module 'jstat' {
  interface ContinuousDistribution {
    pdf(x: number, ...params: number[]): number;
    cdf(x: number, ...params: number[]): number;
    inv(p: number, ...params: number[]): number;
    mean(...params: number[]): number;
    variance(...params: number[]): number;
    sample(...params: number[]): number;
  }
  interface JStatStatic {
    /** Regularized incomplete beta function I_x(a, b). */
    ibeta(x: number, a: number, b: number): number;
    /** Inverse of the regularized incomplete beta function in x. */
    ibetainv(p: number, a: number, b: number): number;
    betafn(a: number, b: number): number;
    betaln(a: number, b: number): number;
    gammaln(x: number): number;
    beta: ContinuousDistribution;
    normal: ContinuousDistribution;
    lognormal: ContinuousDistribution;
    uniform: ContinuousDistribution;
    triangular: ContinuousDistribution;
    binomial: { pdf(k: number, n: number, p: number): number; cdf(k: number, n: number, p: number): number };
    spearmancoeff(a: number[], b: number[]): number;
    corrcoeff(a: number[], b: number[]): number;
  }
  const jStat: JStatStatic;
  export default jStat;
  export { jStat };
}
