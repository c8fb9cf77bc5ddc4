// Types for the parts of jstat the reference checks use (the package ships none).
declare module 'jstat' {
  interface NormalDistribution {
    /** Quantile function. */
    inv(p: number, mean: number, std: number): number;
    cdf(x: number, mean: number, std: number): number;
  }
  const jStat: { normal: NormalDistribution };
  export default jStat;
}
