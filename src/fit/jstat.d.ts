/**
 * The few functions of jstat 1.9.6 (MIT, https://github.com/jstat/jstat) that src/fit/distributions.ts
 * uses. jstat ships no type declarations; this covers only what is called, with the argument
 * order of jstat's own documentation.
 */
declare module 'jstat' {
  interface JStatStatic {
    /** Student's t distribution. */
    readonly studentt: {
      inv(p: number, dof: number): number;
      cdf(x: number, dof: number): number;
    };
    /** Fisher's F distribution. */
    readonly centralF: {
      inv(p: number, df1: number, df2: number): number;
      cdf(x: number, df1: number, df2: number): number;
    };
    readonly normal: {
      inv(p: number, mean: number, sd: number): number;
      cdf(x: number, mean: number, sd: number): number;
    };
    /** The chi-square distribution (cdf: the regularized lower incomplete gamma P(dof/2, x/2)). */
    readonly chisquare: {
      cdf(x: number, dof: number): number;
    };
    /** Regularized incomplete beta function I_x(a, b). */
    ibeta(x: number, a: number, b: number): number;
  }
  const jStat: JStatStatic;
  export default jStat;
}
