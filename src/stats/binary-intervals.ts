/**
 * Score-based intervals for proportions and their differences.
 *
 * Wilson (1927, "Probable inference, the law of succession, and statistical inference", JASA
 * 22:209-212) interval for x events in n:
 *   (2x + z^2 -/+ z sqrt(z^2 + 4 x (n - x) / n)) / (2 (n + z^2))
 *
 * Difference of independent proportions p1 - p2, Newcombe (1998a, "Interval estimation for the
 * difference between independent proportions: comparison of eleven methods", Statistics in
 * Medicine 17:873-890), method 10 (hybrid score, "square and add" of the Wilson limits):
 *   L = d - sqrt((p1 - l1)^2 + (u2 - p2)^2),  U = d + sqrt((u1 - p1)^2 + (p2 - l2)^2)
 *
 * Difference of paired proportions, Newcombe (1998b, "Improved confidence intervals for the
 * difference between binomial proportions based on paired data", Statistics in Medicine
 * 17:2635-2650), method 10: the same with a correlation term phi between the two proportions,
 *   L = d - sqrt((p1 - l1)^2 - 2 phi (p1 - l1)(u2 - p2) + (u2 - p2)^2)
 *   U = d + sqrt((p2 - l2)^2 - 2 phi (p2 - l2)(u1 - p1) + (u1 - p1)^2)
 * where, with A = ad - bc and the four margins' product P, phi = (A - n/2)/sqrt(P) if A > n/2,
 * 0 if 0 <= A <= n/2, A/sqrt(P) if A < 0, and 0 when a margin is empty (as in Fagerland,
 * Lydersen and Laake 2017, "Statistical Analysis of Contingency Tables", ch. 8).
 *
 * Ratio of discordant pairs b/c (paired odds ratio): the Wilson interval for b/(b + c) mapped by
 * pi -> pi/(1 - pi) (the "transformed Wilson score interval", Fagerland, Lydersen and Laake 2017,
 * ch. 8).
 *
 * Worked example (Newcombe 1998a, Table II, example (a), from memory): 56/70 - 48/80 = 0.2,
 * method 10 95% interval [0.0524, 0.3339].
 */

/** Wilson score interval for x events in n trials at normal quantile z (> 0). */
export function wilson(x: number, n: number, z: number): [number, number] {
  const z2 = z * z;
  const centre = 2 * x + z2;
  const spread = z * Math.sqrt(z2 + (4 * x * (n - x)) / n);
  const denom = 2 * (n + z2);
  // At x = 0 (or n) the limit is exactly 0 (or 1); rounding must not push it outside [0, 1].
  const lo = x === 0 ? 0 : Math.max(0, (centre - spread) / denom);
  const hi = x === n ? 1 : Math.min(1, (centre + spread) / denom);
  return [lo, hi];
}

/** Newcombe (1998a) method 10 interval for p1 - p2 from independent groups. */
export function newcombeIndependent(x1: number, n1: number, x2: number, n2: number, z: number): [number, number] {
  const p1 = x1 / n1;
  const p2 = x2 / n2;
  const [l1, u1] = wilson(x1, n1, z);
  const [l2, u2] = wilson(x2, n2, z);
  const d = p1 - p2;
  return [
    Math.max(-1, d - Math.hypot(p1 - l1, u2 - p2)),
    Math.min(1, d + Math.hypot(u1 - p1, p2 - l2)),
  ];
}

/** Newcombe (1998b) method 10 interval for p_first - p_second from a paired table. */
export function newcombePaired(t: { a: number; b: number; c: number; d: number }, z: number): [number, number] {
  const { a, b, c, d } = t;
  const n = a + b + c + d;
  const p1 = (a + b) / n;
  const p2 = (a + c) / n;
  const [l1, u1] = wilson(a + b, n, z);
  const [l2, u2] = wilson(a + c, n, z);
  const phi = correlation(t);
  const dl1 = p1 - l1;
  const du2 = u2 - p2;
  const dl2 = p2 - l2;
  const du1 = u1 - p1;
  const diff = p1 - p2;
  return [
    Math.max(-1, diff - Math.sqrt(Math.max(0, dl1 * dl1 - 2 * phi * dl1 * du2 + du2 * du2))),
    Math.min(1, diff + Math.sqrt(Math.max(0, dl2 * dl2 - 2 * phi * dl2 * du1 + du1 * du1))),
  ];
}

function correlation(t: { a: number; b: number; c: number; d: number }): number {
  const { a, b, c, d } = t;
  const n = a + b + c + d;
  const margins = [a + b, c + d, a + c, b + d];
  if (margins.some((m) => m === 0)) return 0;
  const root = Math.sqrt(margins[0]) * Math.sqrt(margins[1]) * Math.sqrt(margins[2]) * Math.sqrt(margins[3]);
  const A = a * d - b * c;
  if (A > n / 2) return (A - n / 2) / root;
  if (A >= 0) return 0;
  return A / root;
}

/** Transformed Wilson interval for the paired odds ratio b/c (c > 0). */
export function discordantRatioInterval(b: number, c: number, z: number): [number, number] {
  const [l, u] = wilson(b, b + c, z);
  return [l / (1 - l), u >= 1 ? Infinity : u / (1 - u)];
}
