/**
 * Adaptive Gauss-Legendre quadrature: a 10-point rule on a panel is compared with the same rule on
 * its two halves; panels whose estimates differ by more than the tolerance are split again
 * (Davis and Rabinowitz 1984, Methods of Numerical Integration, ch. 6). The nodes are the roots of
 * the Legendre polynomial P_10, found once by Newton's method from the Chebyshev-like starting
 * points cos(pi (i - 1/4) / (n + 1/2)) (Press et al. 2007, Numerical Recipes, 3rd ed., 4.6).
 *
 * Example: integrate(Math.exp, 0, 1, 1e-14) = e - 1 = 1.718281828459045.
 */

const ORDER = 10;
const { nodes: X, weights: W } = legendre(ORDER);

function legendre(n: number): { nodes: number[]; weights: number[] } {
  const nodes: number[] = [];
  const weights: number[] = [];
  for (let i = 1; i <= n; i++) {
    let x = Math.cos((Math.PI * (i - 0.25)) / (n + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      // Recurrence for P_n(x) and its derivative.
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (x * p1 - p0)) / (x * x - 1);
      const dx = p1 / dp;
      x -= dx;
      if (Math.abs(dx) < 1e-16) break;
    }
    nodes.push(x);
    weights.push(2 / ((1 - x * x) * dp * dp));
  }
  return { nodes, weights };
}

function rule(f: (x: number) => number, a: number, b: number): number {
  const h = 0.5 * (b - a);
  const m = 0.5 * (a + b);
  let s = 0;
  for (let i = 0; i < ORDER; i++) s += W[i] * f(m + h * X[i]);
  return s * h;
}

/** The integral of f over [a, b] to an absolute tolerance `tol` (depth-limited). */
export function integrate(f: (x: number) => number, a: number, b: number, tol: number): number {
  return refine(f, a, b, rule(f, a, b), tol, 0);
}

function refine(f: (x: number) => number, a: number, b: number, whole: number, tol: number, depth: number): number {
  const m = 0.5 * (a + b);
  const left = rule(f, a, m);
  const right = rule(f, m, b);
  // Stop at the tolerance, or when the two estimates agree to rounding (a smaller absolute
  // tolerance would only chase rounding noise).
  const both = left + right;
  if (Math.abs(both - whole) <= Math.max(tol, 1e-15 * Math.abs(both)) || depth >= 18) return both;
  return refine(f, a, m, left, tol / 2, depth + 1) + refine(f, m, b, right, tol / 2, depth + 1);
}
