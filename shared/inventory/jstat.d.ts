// jstat 1.9 ships no types; only the part Lumenyard calls is declared. It is CommonJS (module.exports = jStat),
// which ESM and Vite both expose as the default import.
declare module 'jstat' {
  interface JStatNormal {
    /** Quantile (inverse CDF) of N(mean, sd). */
    inv(p: number, mean: number, sd: number): number
    cdf(x: number, mean: number, sd: number): number
  }
  const jStat: { normal: JStatNormal }
  export default jStat
}
