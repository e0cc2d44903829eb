/**
 * Finding sizes and differences from exact power functions.
 *
 * `smallestN` returns the smallest whole n with power(n) >= target for a power function that
 * rises with n. A normal-approximation seed (Guenther 1981, The American Statistician 35, gives
 * the same formula plus a small correction) only says where to look: the exact power brackets the
 * answer (one n below target, one at or above) and bisection closes the bracket, so the answer is
 * always checked at n and at n - 1.
 *
 * `solveIncreasing` finds x with f(x) = target for an increasing f (the noncentrality at which the
 * power reaches the target, for the smallest detectable difference), by bracketing and the
 * Illinois variant of regula falsi.
 *
 * Example: paired, d_z = 0.5, two-sided alpha 0.05, power 0.8: the seed ((1.96 + 0.8416)/0.5)^2
 * = 31.4 starts the search at 32; power(32) = 0.7823 < 0.8, then power(34) = 0.8078 >= 0.8 and
 * power(33) = 0.7954 < 0.8 decide: 34 pairs.
 */
import { InputError } from '../errors.js';

/** Sizes beyond this are refused as unrealistic (and would strain the distribution functions). */
export const MAX_N = 10_000_000;

export interface NSearch {
  n: number;
  power: number;
  /** True when even the smallest allowed n reaches the target. */
  atMinimum: boolean;
  /** Power at n - 1 (undefined at the minimum), the proof that n is the smallest. */
  powerBelow?: number;
}

export function smallestN(powerOf: (n: number) => number, target: number, nMin: number, seed: number): NSearch {
  const memo = new Map<number, number>();
  const p = (n: number): number => {
    let v = memo.get(n);
    if (v === undefined) {
      v = powerOf(n);
      if (Number.isNaN(v)) throw new Error(`power is not a number at n = ${n}`);
      memo.set(n, v);
    }
    return v;
  };
  if (p(nMin) >= target) return { n: nMin, power: p(nMin), atMinimum: true };
  if (!Number.isFinite(seed) || seed > MAX_N) throw tooLarge();
  let lo = nMin; // power below target
  let hi: number; // power at or above target
  const start = Math.min(MAX_N, Math.max(nMin + 1, Math.ceil(seed)));
  if (p(start) >= target) {
    hi = start;
    for (let step = 1; ; step *= 2) {
      const cand = Math.max(nMin, hi - step);
      if (p(cand) < target) { lo = cand; break; }
      hi = cand;
      if (cand === nMin) return { n: nMin, power: p(nMin), atMinimum: true };
    }
  } else {
    lo = start;
    for (let step = Math.max(1, Math.ceil(start * 0.05)); ; step *= 2) {
      const cand = lo + step;
      if (cand > MAX_N) {
        if (p(MAX_N) < target) throw tooLarge();
        hi = MAX_N;
        break;
      }
      if (p(cand) >= target) { hi = cand; break; }
      lo = cand;
    }
  }
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    if (p(mid) >= target) hi = mid;
    else lo = mid;
  }
  return { n: hi, power: p(hi), atMinimum: false, powerBelow: p(hi - 1) };
}

function tooLarge(): InputError {
  return new InputError(
    `the study would need more than ${MAX_N.toLocaleString('en-US')} per group or pairs: the difference is tiny compared with the spread; check --difference and the SD options`,
  );
}

/** x in [lo, infinity) with f(x) = target for increasing f; f(lo) must be below target. */
export function solveIncreasing(f: (x: number) => number, target: number, lo: number, start: number): number {
  let a = lo;
  let fa = f(a) - target;
  if (fa >= 0) return a;
  let b = Math.max(start, lo + 1e-6);
  let fb = f(b) - target;
  while (fb < 0) {
    a = b;
    fa = fb;
    b = 2 * b + 1;
    if (b > 1e8) throw new Error('could not bracket the root');
    fb = f(b) - target;
  }
  let side = 0;
  for (let i = 0; i < 200; i++) {
    let x = (a * fb - b * fa) / (fb - fa);
    if (!(x > a && x < b)) x = 0.5 * (a + b);
    const fx = f(x) - target;
    if (fx === 0) return x;
    if (fx < 0) { a = x; fa = fx; if (side === -1) fb /= 2; side = -1; }
    else { b = x; fb = fx; if (side === 1) fa /= 2; side = 1; }
    if (b - a <= 1e-10 * Math.max(1, Math.abs(x))) break;
  }
  return 0.5 * (a + b);
}
