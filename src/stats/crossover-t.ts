/**
 * The 2x2 (AB/BA) crossover analysis of Hills and Armitage (1979, "The two-period cross-over
 * clinical trial", British Journal of Clinical Pharmacology 8: 7-20); see also Senn (2002),
 * Cross-over Trials in Clinical Research, ch. 3, and Jones and Kenward (2014), ch. 2.
 *
 * Model. Subject j of sequence i in period k (k = 1, 2):
 *   y_ijk = mu + s_ij + pi_k + tau_c(i,k) + e_ijk
 * with a subject effect s_ij, period effects pi_1, pi_2, condition effects tau_F (first condition)
 * and tau_S (second), independent errors of variance sigma^2, and no carryover. Sequence FS
 * ("firstThenSecond") gets F in period 1; sequence SF ("secondThenFirst") gets S in period 1.
 * Write tau = tau_F - tau_S (the effect reported, first minus second) and pi = pi_1 - pi_2.
 * The half period difference h = (y_1 - y_2)/2 removes the subject effect:
 *   E[h | FS] = (pi + tau)/2,   E[h | SF] = (pi - tau)/2,   var(h) = sigma^2 / 2.
 * Hence
 *   treatment effect  tau_hat = mean(h | FS) - mean(h | SF)
 *   period effect     pi_hat  = mean(h | FS) + mean(h | SF)     (period 1 minus period 2)
 * both with se = s_h sqrt(1/n1 + 1/n2), where s_h^2 pools the variances of h within the two
 * sequences on df = n1 + n2 - 2: a pooled two-sample t on the half differences. The treatment
 * test follows the alternative and null value; the period effect is always reported two-sided.
 *
 * Carryover. With carryover lambda_F (of F into period 2) and lambda_S, the subject totals
 * y_1 + y_2 differ between sequences by lambda_F - lambda_S; their two-sample t is shown in
 * details for information only. It compares subjects, not periods within subjects, so it has low
 * power; and testing it first to choose between the crossover and a first-period-only analysis is
 * biased and inflates the error rate (Freeman 1989, "The performance of the two-stage analysis of
 * two-treatment, two-period crossover trials", Statistics in Medicine 8). Carryover is a matter of
 * design (washout), not of this test.
 *
 * Example (invented): FS subjects with (period 1, period 2) = (12, 10), (14, 11), (11, 10) and SF
 * subjects (9, 12), (10, 12), (11, 14): h = 1, 1.5, 0.5 and -1.5, -1, -1.5, so tau_hat = 2.3333,
 * pi_hat = -0.3333, s_h = 0.4082, se = 0.3333, t = 7.0 on 4 df.
 */
import { StatsError } from '../errors.js';
import { checkCount, checkFinite, isRoundingLevel, maxAbs, scaleFor, show, summarize, type Summary } from './sample.js';
import { intervalNote, tInference, tResultFields } from './t-inference.js';
import type { ProcedureInput, ProcedureOptions, TestResult } from './types.js';

type CrossoverInput = Extract<ProcedureInput, { kind: 'crossover' }>;
type Sequence = { period1: number[]; period2: number[] };

export function crossoverT(input: CrossoverInput, o: ProcedureOptions): TestResult {
  const fs = checkSequence(input.firstThenSecond, 'firstThenSecond');
  const sf = checkSequence(input.secondThenFirst, 'secondThenFirst');
  if (fs.period1.length + sf.period1.length < 3) {
    throw new StatsError('too-few', 'crossover t: needs at least 3 subjects in all (and one in each sequence) to estimate the within-subject spread');
  }
  const scale = scaleFor(fs.period1, fs.period2, sf.period1, sf.period2);
  const inputScale = maxAbs(fs.period1, fs.period2, sf.period1, sf.period2) * scale;
  const h1 = roundingToConstant(summarize(halfDifferences(fs, scale)), inputScale);
  const h2 = roundingToConstant(summarize(halfDifferences(sf, scale)), inputScale);
  if (h1.variance === 0 && h2.variance === 0) {
    throw new StatsError(
      'no-variation',
      `the half period differences are constant within each sequence (every firstThenSecond subject has ${show(h1.mean / scale)}, every secondThenFirst subject ${show(h2.mean / scale)}): the t statistic is undefined; the data show no within-subject variation to test against`,
    );
  }
  const pooled = pool(h1, h2);
  const inf = tInference({ estimate: h1.mean - h2.mean, se: pooled.se, df: pooled.df, scale }, o);
  const period = tInference(
    { estimate: h1.mean + h2.mean, se: pooled.se, df: pooled.df, scale },
    { alternative: 'two-sided', confidence: o.confidence, nullValue: 0 },
  );
  const carry = carryover(fs, sf, scale, o.confidence);
  return {
    procedure: 'crossover-t',
    method: '2x2 crossover: half period differences compared between sequence groups (Hills and Armitage 1979)',
    ...tResultFields(inf, pooled.df, o),
    estimateName: 'treatment effect (first minus second), adjusted for the period effect',
    n: { pairs: h1.n + h2.n },
    effectSize: null,
    notes: [
      'the analysis assumes no carryover from period 1 into period 2 (an adequate washout by design); it allows a period effect',
      ...intervalNote(o.alternative),
      'the period effect (period 1 minus period 2) is reported two-sided at the same confidence level',
      'the carryover comparison of subject totals is shown for information only: it has low power, and using it to choose the analysis is biased (Freeman 1989)',
      ...(carry.note ? [carry.note] : []),
      'no standardized effect size is given for the crossover; the treatment effect is in the outcome unit',
    ],
    details: {
      nFirstThenSecond: h1.n,
      nSecondThenFirst: h2.n,
      meanHalfDifferenceFirstThenSecond: h1.mean / scale,
      meanHalfDifferenceSecondThenFirst: h2.mean / scale,
      sdHalfDifferences: pooled.sp / scale,
      sdWithinSubject: (Math.SQRT2 * pooled.sp) / scale,
      se: inf.se,
      periodEffect: period.estimate,
      periodCi: period.ci,
      periodT: period.statistic,
      periodPValue: period.pValue,
      carryoverEstimate: carry.estimate,
      carryoverCi: carry.ci,
      carryoverT: carry.statistic,
      carryoverPValue: carry.pValue,
      /** Order: firstThenSecond period 1, period 2; secondThenFirst period 1, period 2. */
      cellMeans: [fs.period1, fs.period2, sf.period1, sf.period2].map((v) => summarize(v, scale).mean / scale),
    },
  };
}

function checkSequence(s: Sequence, name: string): Sequence {
  checkFinite(s.period1, `crossover t, ${name} period 1`);
  checkFinite(s.period2, `crossover t, ${name} period 2`);
  if (s.period1.length !== s.period2.length) {
    throw new StatsError(
      'invalid-option',
      `crossover t, ${name}: ${s.period1.length} period-1 values but ${s.period2.length} period-2 values; each subject needs one value in each period`,
    );
  }
  checkCount(s.period1.length, 1, `crossover t, ${name} subjects`, 'each sequence needs at least one complete subject');
  return s;
}

/** Half period differences (period 1 - period 2) / 2, in scaled units. */
function halfDifferences(s: Sequence, scale: number): Float64Array {
  const out = new Float64Array(s.period1.length);
  for (let i = 0; i < out.length; i++) out[i] = (s.period1[i] * scale - s.period2[i] * scale) / 2;
  return out;
}

/** Subject totals period 1 + period 2, in scaled units (at most 2 in magnitude). */
function totals(s: Sequence, scale: number): Float64Array {
  const out = new Float64Array(s.period1.length);
  for (let i = 0; i < out.length; i++) out[i] = s.period1[i] * scale + s.period2[i] * scale;
  return out;
}

function roundingToConstant(s: Summary, inputScale: number): Summary {
  return s.variance > 0 && isRoundingLevel(s, inputScale) ? { ...s, variance: 0, sd: 0 } : s;
}

function pool(a: Summary, b: Summary): { sp: number; se: number; df: number } {
  const df = a.n + b.n - 2;
  const sp = Math.sqrt(((a.n - 1) * a.variance + (b.n - 1) * b.variance) / df);
  return { sp, se: sp * Math.sqrt(1 / a.n + 1 / b.n), df };
}

/** Subject totals compared between sequences (two-sided pooled t); null parts when totals are constant. */
interface Carryover {
  estimate: number;
  ci: [number, number] | null;
  statistic: number | null;
  pValue: number | null;
  note: string | null;
}

function carryover(fs: Sequence, sf: Sequence, scale: number, confidence: number): Carryover {
  const inputScale = maxAbs(fs.period1, fs.period2, sf.period1, sf.period2) * scale;
  const t1 = roundingToConstant(summarize(totals(fs, scale)), 2 * inputScale);
  const t2 = roundingToConstant(summarize(totals(sf, scale)), 2 * inputScale);
  if (t1.variance === 0 && t2.variance === 0) {
    return { estimate: (t1.mean - t2.mean) / scale, ci: null, statistic: null, pValue: null, note: 'subject totals show no variation within sequences: no carryover comparison is computed' };
  }
  const p = pool(t1, t2);
  const r = tInference({ estimate: t1.mean - t2.mean, se: p.se, df: p.df, scale }, { alternative: 'two-sided', confidence, nullValue: 0 });
  return { estimate: r.estimate, ci: r.ci, statistic: r.statistic, pValue: r.pValue, note: null };
}
