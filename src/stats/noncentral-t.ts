/** Placeholder: the noncentral t distribution (Lenth 1989 AS 243; Benton and Krishnamoorthy 2003). */
export function noncentralTCdf(_x: number, _df: number, _ncp: number): number {
  throw new Error('noncentral t is not built yet');
}
/** Upper tail P(T' > x), computed directly. */
export function noncentralTSf(_x: number, _df: number, _ncp: number): number {
  throw new Error('noncentral t is not built yet');
}
