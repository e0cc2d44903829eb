/**
 * Turning what the user gave (options, or a plan's planning section) into a checked SizeSpec and
 * the question to answer. Every refusal is an InputError that names the option, what is allowed
 * and what was given. The rules:
 *
 * - The effect: `difference` in the outcome's units with spreads, or a standardized `effectSize`.
 *   Paired: the SD of differences directly (`sdDiff`), or the single-measurement `sd` with the
 *   correlation `rho` (sdDiff = sd * sqrt(2 (1 - rho))). A paired effect size is d_z (difference /
 *   SD of differences), except with `rho`, where it is d (difference / single-measurement SD).
 *   Independent: `sd` (and `sd2` for a second group with another spread), effect size d.
 * - `n` alone asks for the smallest detectable difference; `n` with an effect asks for the power.
 * - A `margin` makes it an equivalence question (two one-sided tests); the expected difference
 *   then defaults to 0 and must lie strictly inside the margin.
 */
import { InputError } from '../errors.js';
import type { Alternative } from '../stats/types.js';
import { minimumN } from './power.js';
import type { Question, SizeDesign, SizeSpec } from './types.js';

export interface RawSizeInputs {
  design?: SizeDesign;
  difference?: number;
  sd?: number;
  sd2?: number;
  sdDiff?: number;
  rho?: number;
  effectSize?: number;
  alpha?: number;
  power?: number;
  alternative?: Alternative;
  ratio?: number;
  attrition?: number;
  n?: number;
  margin?: number;
}

export type RawKey = keyof RawSizeInputs;

/** How each input is called on the command line. */
export const OPTION_NAMES: Record<RawKey, string> = {
  design: '--design', difference: '--difference', sd: '--sd', sd2: '--sd2', sdDiff: '--sd-diff', rho: '--rho',
  effectSize: '--effect-size', alpha: '--alpha', power: '--power', alternative: '--alternative', ratio: '--ratio',
  attrition: '--attrition', n: '--n', margin: '--margin',
};

export interface ResolvedInputs {
  spec: SizeSpec;
  question: Question;
  n?: number;
  /** What was assumed, to be said in the report. */
  notes: string[];
}

/** `name` says where a value came from, e.g. "--sd" or "--sd (planning.sd in plan.yaml)". */
export function resolveInputs(raw: RawSizeInputs, name: (k: RawKey) => string = (k) => OPTION_NAMES[k]): ResolvedInputs {
  const fail = (msg: string): never => { throw new InputError(msg); };
  const has = (k: RawKey): boolean => raw[k] !== undefined;
  const check = (k: RawKey, ok: (v: number) => boolean, allowed: string): void => {
    const v = raw[k] as number | undefined;
    if (v !== undefined && !(Number.isFinite(v) && ok(v))) fail(`${name(k)} must be ${allowed}; got ${v}`);
  };
  check('sd', (v) => v > 0, 'a positive number (a spread cannot be zero or negative)');
  check('sd2', (v) => v > 0, 'a positive number (a spread cannot be zero or negative)');
  check('sdDiff', (v) => v > 0, 'a positive number (a spread cannot be zero or negative)');
  check('rho', (v) => v > -1 && v < 1, 'a correlation strictly between -1 and 1');
  check('alpha', (v) => v > 0 && v < 1, 'a probability strictly between 0 and 1');
  check('power', (v) => v > 0 && v < 1, 'a probability strictly between 0 and 1');
  check('attrition', (v) => v >= 0 && v < 1, 'a share in [0, 1) (0.1 means 10% lost)');
  check('ratio', (v) => v >= 0.01 && v <= 100, 'an allocation ratio n2/n1 in [0.01, 100]');
  check('margin', (v) => v > 0, 'a positive number (the equivalence range is -margin to +margin)');
  check('difference', () => true, 'a finite number');
  check('effectSize', () => true, 'a finite number');
  check('n', (v) => Number.isInteger(v) && v >= 2 && v <= 1e7, 'a whole number from 2 to 10,000,000');

  const design = raw.design ?? fail(`say which design to plan: ${name('design')} paired or ${name('design')} independent`);
  if (design !== 'paired' && design !== 'independent') fail(`${name('design')} must be paired or independent; got ${String(design)}`);
  const alpha = raw.alpha ?? 0.05;
  const power = raw.power ?? 0.8;
  const alternative = raw.alternative ?? 'two-sided';
  const equivalence = has('margin');
  const notes: string[] = [];
  if (has('difference') && has('effectSize')) fail(`give either ${name('difference')} or ${name('effectSize')}, not both`);
  if (equivalence && alternative !== 'two-sided') fail(`${name('alternative')} does not apply to equivalence (${name('margin')}): both one-sided tests are always made`);

  let difference: number | undefined = raw.difference;
  let sd = raw.sd;
  let sdDiff = raw.sdDiff;
  let rho = raw.rho;
  let standardized = false;
  if (design === 'paired') {
    if (has('ratio')) fail(`${name('ratio')} is for independent groups; a paired design has one n (pairs)`);
    if (has('sd2')) fail(`${name('sd2')} is for independent groups with different spreads`);
    if (has('sdDiff') && has('rho')) fail(`give either ${name('sdDiff')} or ${name('rho')} (with ${name('sd')}), not both`);
    if (has('rho') || (has('sd') && !has('sdDiff'))) {
      if (!has('rho')) fail(`a paired design needs the SD of the differences: give ${name('sdDiff')}, or ${name('sd')} with ${name('rho')} (the correlation between the two members of a pair)`);
      if (!has('sd')) {
        if (has('difference')) fail(`${name('rho')} needs ${name('sd')} (the SD of single measurements) to give the SD of differences`);
        sd = 1;
        standardized = true;
      }
      sdDiff = (sd as number) * Math.sqrt(2 * (1 - (rho as number)));
      if (has('effectSize')) difference = (raw.effectSize as number) * (sd as number);
    } else if (has('sdDiff')) {
      if (has('sd')) {
        rho = 1 - ((sdDiff as number) ** 2) / (2 * (sd as number) ** 2);
        if (!(rho > -1 && rho < 1)) fail(`${name('sd')} ${sd} and ${name('sdDiff')} ${sdDiff} imply a correlation of ${rho.toFixed(3)}, outside (-1, 1)`);
      }
      if (has('effectSize')) difference = (raw.effectSize as number) * (sdDiff as number);
    } else {
      if (has('difference')) fail(`a paired design needs the SD of the differences: give ${name('sdDiff')}, or ${name('sd')} with ${name('rho')}`);
      sdDiff = 1;
      standardized = true;
      if (has('effectSize')) difference = raw.effectSize;
    }
  } else {
    if (has('rho')) fail(`${name('rho')} is for paired designs (independent groups share no pairs)`);
    if (has('sdDiff')) fail(`${name('sdDiff')} is for paired designs; give ${name('sd')} for independent groups`);
    if (has('sd2') && !has('sd')) fail(`${name('sd2')} needs ${name('sd')} (the first group's SD)`);
    if (!has('sd')) {
      if (has('difference')) fail(`independent groups need the SD of single measurements: give ${name('sd')}`);
      sd = 1;
      standardized = true;
    }
    if (has('effectSize')) difference = (raw.effectSize as number) * (sd as number);
    sdDiff = (sd as number) * Math.SQRT2;
  }

  let question: Question;
  if (difference === undefined) {
    if (equivalence) {
      difference = 0;
      notes.push('the true difference is assumed to be 0 (give --difference to plan for another)');
      question = has('n') ? 'power' : 'sample-size';
    } else if (has('n')) {
      question = 'detectable-difference';
    } else {
      return fail(`give the difference to detect (${name('difference')} with the SD options, or ${name('effectSize')}), or ${name('n')} to ask for the smallest detectable difference`);
    }
  } else {
    question = has('n') ? 'power' : 'sample-size';
  }
  if (equivalence) {
    if (!(Math.abs(difference as number) < (raw.margin as number))) {
      fail(`${name('margin')} ${raw.margin} must be larger than the size of the expected difference (${difference}): equivalence cannot be shown when the truth lies on or outside the margin`);
    }
  } else if (question !== 'detectable-difference') {
    const d = difference as number;
    if (d === 0 && question === 'sample-size') fail(`a difference of 0 cannot be detected with any number of ${design === 'paired' ? 'pairs' : 'units'}: power stays at alpha however large the study; give the smallest difference that matters`);
    if (question === 'sample-size' && alternative === 'greater' && d < 0) fail(`the expected difference ${d} is negative but ${name('alternative')} is greater: no study size reaches the power; use less or two-sided`);
    if (question === 'sample-size' && alternative === 'less' && d > 0) fail(`the expected difference ${d} is positive but ${name('alternative')} is less: no study size reaches the power; use greater or two-sided`);
  }
  if (!equivalence && question !== 'power' && !(power > alpha)) fail(`${name('power')} (${power}) must be larger than ${name('alpha')} (${alpha}): any study has power alpha against a zero difference`);

  const spec: SizeSpec = {
    design,
    difference: difference ?? 0,
    sdDiff: sdDiff as number,
    sd,
    sd2: design === 'independent' ? raw.sd2 : undefined,
    rho,
    ratio: design === 'independent' ? (raw.ratio ?? 1) : 1,
    alpha,
    power,
    alternative,
    attrition: raw.attrition ?? 0,
    margin: raw.margin,
    standardized,
  };
  if (raw.n !== undefined && raw.n < minimumN(spec)) {
    fail(`${name('n')} must be at least ${minimumN(spec)} for this design (each group needs 2 units); got ${raw.n}`);
  }
  return { spec, question, n: raw.n, notes };
}
