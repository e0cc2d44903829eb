/**
 * Interval for the probability of superiority theta = P(X > Y) + 0.5 P(X = Y), estimated by
 * U / (n1 n2): Newcombe (2006), "Confidence intervals for an effect size measure based on the
 * Mann-Whitney statistic. Part 2: asymptotic methods and evaluation", Statistics in Medicine
 * 25:559-573, method 5.
 *
 * The variance of the estimate under exponential-shaped distributions (Hanley and McNeil 1982,
 * Radiology 143:29-36) is written as a function of theta, with both group sizes replaced by
 * their mean N/2 (N = n1 + n2) so the interval does not depend on which group is "first":
 *   V(theta) = theta (1 - theta) [1 + (N/2 - 1)(1 - theta)/(2 - theta) + (N/2 - 1) theta/(1 + theta)] / (n1 n2)
 * The limits are the solutions of (theta_hat - theta)^2 = z^2 V(theta) on either side of the
 * estimate (a score-type interval: it stays inside [0, 1] and is not degenerate at 0 or 1).
 * Each limit is found by scanning from the estimate outward for the first sign change, then by
 * bisection to full precision.
 *
 * Example (computed with this formula, cross-checked against numpy polynomial roots in
 * test/fixtures/scipy-rank): theta_hat = 0.8, n1 = n2 = 10, 95%: [0.5418, 0.9255].
 */
import { normalQuantile } from './distributions.js';
import type { Alternative } from './types.js';

export function superiorityInterval(theta: number, n1: number, n2: number, confidence: number, alternative: Alternative): [number, number] {
  const alpha = 1 - confidence;
  const z = -normalQuantile(alternative === 'two-sided' ? alpha / 2 : alpha);
  const half = (n1 + n2) / 2 - 1;
  const mn = n1 * n2;
  const excess = (t: number): number => {
    const v = (t * (1 - t) * (1 + (half * (1 - t)) / (2 - t) + (half * t) / (1 + t))) / mn;
    return (theta - t) * (theta - t) - z * z * v;
  };
  const lower = alternative === 'less' ? 0 : limit(excess, theta, 0);
  const upper = alternative === 'greater' ? 1 : limit(excess, theta, 1);
  return [lower, upper];
}

/** Walk from the estimate toward `end` to the first point where excess > 0, then bisect. */
function limit(excess: (t: number) => number, theta: number, end: number): number {
  if (theta === end) return end;
  const steps = 256;
  let inside = theta;
  for (let s = 1; s <= steps; s++) {
    const t = theta + ((end - theta) * s) / steps;
    if (excess(t) > 0) {
      let a = inside;
      let b = t;
      for (let i = 0; i < 200 && Math.abs(b - a) > 1e-15; i++) {
        const mid = (a + b) / 2;
        if (excess(mid) > 0) b = mid;
        else a = mid;
      }
      return (a + b) / 2;
    }
    inside = t;
  }
  return end;
}
