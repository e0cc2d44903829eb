/**
 * Sample sizes and powers against test/fixtures/size-power/size.json, written by the committed
 * generate.py beside it (scipy.stats.nct for the search, mpmath integration for the powers at n
 * and n - 1, numpy simulation for the equivalence powers and for Welch's achieved power).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { resolveInputs } from '../../src/size/inputs.js';
import { planPower, sampleSize } from '../../src/size/solve.js';
import { powerAtNcp } from '../../src/size/power.js';
import { tostPower } from '../../src/size/equivalence.js';
import { tQuantile } from '../../src/stats/distributions.js';
import type { Alternative } from '../../src/stats/types.js';

interface Sup { design: 'paired' | 'independent'; d: number; alpha: number; power: number; alternative: Alternative; ratio?: number; sd2?: number; n: number; total: number; powerAtN: number; powerBelow: number | null }
interface WelchSim { d: number; sd2: number; ratio: number; n: number; alpha: number; approximatePower: number; simulatedPower: number; simulationSE: number }
interface Det { df: number; alpha: number; power: number; alternative: Alternative; ncp: number }
interface Tost { design: 'paired' | 'independent'; sd: number; delta: number; margin: number; alpha: number; power: number; n: number; powerAtN: number; powerBelow: number }
interface Cross { N: number; se: number; df: number; delta: number; margin: number; alpha: number; power: number }
const fx = JSON.parse(readFileSync(new URL('../fixtures/size-power/size.json', import.meta.url), 'utf8')) as {
  source: string; superiority: Sup[]; welchSimulation: WelchSim[]; detectable: Det[]; tost: Tost[]; crossover: Cross[];
};

function close(got: number, want: number, tol: number, what: string): void {
  const err = Math.abs(got - want) / Math.abs(want);
  expect(err, `${what}: got ${got}, expected ${want} (${fx.source}), relative error ${err.toExponential(2)} > ${tol}`).toBeLessThanOrEqual(tol);
}

describe('smallest n and exact power against scipy/mpmath', () => {
  it.each(fx.superiority.map((c) => [`${c.design} d=${c.d} alpha=${c.alpha} power=${c.power} ${c.alternative}${c.ratio ? ` ratio=${c.ratio}` : ''}${c.sd2 ? ` sd2=${c.sd2}` : ''}`, c] as const))('%s', (_label, c) => {
    const spec = resolveInputs({ design: c.design, difference: c.d, ...(c.design === 'paired' ? { sdDiff: 1 } : { sd: 1, sd2: c.sd2, ratio: c.ratio }), alpha: c.alpha, power: c.power, alternative: c.alternative }).spec;
    const ans = sampleSize(spec);
    expect(ans.layout.n, 'smallest n').toBe(c.n);
    expect(ans.layout.total).toBe(c.total);
    close(ans.power, c.powerAtN, 1e-8, `power at n = ${c.n}`);
    if (c.powerBelow !== null) close(planPower(spec, c.n - 1), c.powerBelow, 1e-8, `power at n - 1 = ${c.n - 1}`);
  });
});

describe("Welch: the noncentral t with Satterthwaite df against Welch's simulated power", () => {
  // An approximation (see src/size/power.ts); the simulation shows it is close at these sizes.
  it.each(fx.welchSimulation.map((w) => [`sd2=${w.sd2} ratio=${w.ratio} n=${w.n}`, w] as const))('%s', (_l, w) => {
    expect(Math.abs(w.approximatePower - w.simulatedPower)).toBeLessThan(0.01 + 4 * w.simulationSE);
  });
});

describe('detectable noncentrality against scipy brentq', () => {
  it.each(fx.detectable.map((d) => [`df=${d.df} alpha=${d.alpha} power=${d.power} ${d.alternative}`, d] as const))('%s', (_l, d) => {
    close(powerAtNcp(d.ncp, d.df, d.alpha, d.alternative), d.power, 1e-9, 'power at the reference noncentrality');
  });
  it('the detectable difference at 20 pairs has exactly the target power', () => {
    const d = fx.detectable.find((x) => x.df === 19) as Det;
    const raw = { design: 'paired', sdDiff: 2, n: 20, alpha: d.alpha, power: d.power, alternative: d.alternative } as const;
    const spec = resolveInputs(raw).spec;
    // ncp = difference / (sdDiff / sqrt(n))
    close(planPower(spec, 20, (d.ncp * 2) / Math.sqrt(20)), d.power, 1e-9, 'power');
  });
});

describe('equivalence (two one-sided tests) against mpmath integration and simulation', () => {
  it.each(fx.tost.map((t) => [`${t.design} sd=${t.sd} delta=${t.delta} margin=${t.margin} alpha=${t.alpha}`, t] as const))('%s', (_l, t) => {
    const spec = resolveInputs({ design: t.design, difference: t.delta, ...(t.design === 'paired' ? { sdDiff: t.sd } : { sd: t.sd }), margin: t.margin, alpha: t.alpha, power: t.power }).spec;
    const ans = sampleSize(spec);
    expect(ans.layout.n, 'smallest n').toBe(t.n);
    close(ans.power, t.powerAtN, 1e-8, `power at n = ${t.n}`);
    close(planPower(spec, t.n - 1), t.powerBelow, 1e-8, `power at n - 1`);
  });
  it.each(fx.crossover.map((c) => [`log-scale crossover, N = ${c.N}`, c] as const))('%s', (_l, c) => {
    close(tostPower(c.se, c.df, c.delta, c.margin, tQuantile(1 - c.alpha, c.df)), c.power, 1e-8, 'power');
  });
});
