/**
 * Shared by the t-family tests: the scipy fixture (test/fixtures/scipy-t/generate.py), a relative
 * comparison that prints value, expected, difference and tolerance, and option shorthands.
 */
import { readFileSync } from 'node:fs';
import { expect } from 'vitest';
import { StatsError } from '../../src/errors.js';
import { checkOptions } from '../../src/stats/index.js';
import type { Alternative, ProcedureOptions } from '../../src/stats/types.js';

export const ALTS: Alternative[] = ['two-sided', 'greater', 'less'];

type Ci = [number | null, number | null];
export interface AltResult { statistic: number; df: number; pValue: number; ci: Ci }
export interface PairedFixture {
  name: string; first: number[]; second: number[]; nullValue: number; confidence: number;
  results: Record<Alternative, AltResult>; estimate: number; sdDifferences: number;
  dz: { value: number; ci: Record<Alternative, Ci> };
}
export interface IndependentFixture {
  name: string; first: number[]; second: number[]; nullValue: number; confidence: number;
  welch: Record<Alternative, AltResult>; pooled: Record<Alternative, AltResult>; estimate: number;
  hedgesG: { value: number; d: number; J: number; ci: Record<Alternative, Ci> };
}
export interface TostFixture {
  name: string; first: number[]; second: number[]; margin: number; confidence: number;
  tLower: number; pLower: number; tUpper: number; pUpper: number; pValue: number; df: number;
  ci: Ci; level: number; estimate: number;
}
export interface CrossoverFixture {
  name: string; firstThenSecond: { period1: number[]; period2: number[] }; secondThenFirst: { period1: number[]; period2: number[] };
  nullValue: number; confidence: number; estimate: number; se: number; results: Record<Alternative, AltResult>;
  period: { estimate: number; ci: [number, number]; statistic: number; pValue: number };
  carryover: { estimate: number; statistic: number; pValue: number };
  sdWithinSubject: number;
}

export const scipy = JSON.parse(readFileSync(new URL('../fixtures/scipy-t/t-family.json', import.meta.url), 'utf8')) as {
  scipy: string; numpy: string;
  paired: PairedFixture[]; independent: IndependentFixture[];
  pairedEquivalence: TostFixture[]; welchEquivalence: TostFixture[]; crossover: CrossoverFixture[];
};
export const SCIPY = `scipy ${scipy.scipy}`;

/** Relative comparison (absolute below `floor`); the failure message carries everything needed. */
export function close(value: number, expected: number, tol: number, label: string, floor = 0): void {
  if (value === expected) return;
  const diff = Math.abs(value - expected);
  const scale = Math.max(Math.abs(expected), floor);
  const ok = Number.isFinite(value) && diff <= tol * scale;
  expect(ok, `${label}: value ${value}, expected ${expected}, difference ${diff.toExponential(3)}, tolerance ${tol} relative (of ${scale})`).toBe(true);
}

/** Interval ends: null in the fixture is an infinite end. */
export function closeCi(ci: [number, number], want: Ci, tol: number, label: string, floor = 0): void {
  const w: [number, number] = [want[0] ?? -Infinity, want[1] ?? Infinity];
  for (const k of [0, 1] as const) {
    if (!Number.isFinite(w[k])) expect(ci[k], `${label} end ${k}`).toBe(w[k]);
    else close(ci[k], w[k], tol, `${label} end ${k}`, floor);
  }
}

export function opts(partial: Partial<ProcedureOptions> = {}): ProcedureOptions {
  return checkOptions(partial);
}

/** Runs fn and returns the StatsError it throws (fails the test otherwise). */
export function statsError(fn: () => unknown): StatsError {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(StatsError);
    return e as StatsError;
  }
  throw new Error('expected a StatsError, none was thrown');
}
