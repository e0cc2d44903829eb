/**
 * Bad input is refused with a message that names the option and the allowed range (InputError,
 * exit code 2 at the command line); good input resolves to the spreads the formulas need.
 */
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { resolveInputs, type RawSizeInputs } from '../../src/size/inputs.js';

function refused(raw: RawSizeInputs): string {
  try {
    resolveInputs(raw);
  } catch (err) {
    expect(err).toBeInstanceOf(InputError);
    return (err as Error).message;
  }
  throw new Error(`accepted ${JSON.stringify(raw)}`);
}

const paired = { design: 'paired', difference: 2, sdDiff: 3 } as const;

describe('size inputs: refusals name the option and the allowed range', () => {
  it.each([
    [{ ...paired, sdDiff: 0 }, /--sd-diff must be a positive number.*got 0/],
    [{ ...paired, sdDiff: -1 }, /--sd-diff must be a positive number/],
    [{ design: 'independent', difference: 1, sd: -2 }, /--sd must be a positive number/],
    [{ design: 'independent', difference: 1, sd: 2, sd2: 0 }, /--sd2 must be a positive number/],
    [{ design: 'paired', difference: 1, sd: 2, rho: 1 }, /--rho must be a correlation strictly between -1 and 1; got 1/],
    [{ design: 'paired', difference: 1, sd: 2, rho: -1.2 }, /--rho must be a correlation strictly between -1 and 1/],
    [{ ...paired, alpha: 0 }, /--alpha must be a probability strictly between 0 and 1; got 0/],
    [{ ...paired, alpha: 1.5 }, /--alpha must be a probability/],
    [{ ...paired, power: 1 }, /--power must be a probability strictly between 0 and 1; got 1/],
    [{ ...paired, attrition: 1 }, /--attrition must be a share in \[0, 1\)/],
    [{ design: 'independent', difference: 1, sd: 2, ratio: 0 }, /--ratio must be an allocation ratio/],
    [{ ...paired, n: 1 }, /--n must be a whole number from 2/],
    [{ ...paired, n: 10.5 }, /--n must be a whole number/],
    [{ ...paired, margin: -1 }, /--margin must be a positive number/],
  ] as [RawSizeInputs, RegExp][])('%j', (raw, message) => {
    expect(refused(raw)).toMatch(message);
  });

  it('a difference of zero has no finite n, and says so', () => {
    expect(refused({ ...paired, difference: 0 })).toMatch(/difference of 0 cannot be detected with any number of pairs/);
    expect(refused({ design: 'independent', effectSize: 0 })).toMatch(/difference of 0 cannot be detected with any number of units/);
  });
  it('an equivalence margin not larger than the expected difference is refused', () => {
    expect(refused({ ...paired, difference: 2, margin: 2 })).toMatch(/--margin 2 must be larger than the size of the expected difference \(2\)/);
    expect(refused({ ...paired, difference: -3, margin: 2 })).toMatch(/--margin 2 must be larger/);
  });
  it('a one-sided alternative against the expected direction is refused', () => {
    expect(refused({ ...paired, difference: -2, alternative: 'greater' })).toMatch(/negative but --alternative is greater/);
    expect(refused({ ...paired, difference: 2, alternative: 'less' })).toMatch(/positive but --alternative is less/);
  });
  it('missing or conflicting effect and spread options are named', () => {
    expect(refused({ difference: 1, sdDiff: 1 })).toMatch(/--design paired or --design independent/);
    expect(refused({ design: 'paired' })).toMatch(/give the difference to detect/);
    expect(refused({ design: 'paired', difference: 1 })).toMatch(/--sd-diff, or --sd with --rho/);
    expect(refused({ design: 'paired', difference: 1, sd: 2 })).toMatch(/--sd-diff, or --sd with --rho/);
    expect(refused({ design: 'paired', difference: 1, sdDiff: 2, rho: 0.3 })).toMatch(/either --sd-diff or --rho/);
    expect(refused({ design: 'paired', difference: 1, effectSize: 0.5, sdDiff: 1 })).toMatch(/either --difference or --effect-size/);
    expect(refused({ design: 'independent', difference: 1 })).toMatch(/give --sd/);
    expect(refused({ design: 'independent', difference: 1, sd: 1, rho: 0.5 })).toMatch(/--rho is for paired designs/);
    expect(refused({ design: 'paired', difference: 1, sdDiff: 1, ratio: 2 })).toMatch(/--ratio is for independent groups/);
    expect(refused({ design: 'paired', difference: 1, sd: 1, sdDiff: 3 })).toMatch(/imply a correlation of -3.500, outside \(-1, 1\)/);
    expect(refused({ ...paired, margin: 3, alternative: 'greater' })).toMatch(/--alternative does not apply to equivalence/);
    expect(refused({ ...paired, power: 0.04, alpha: 0.05 })).toMatch(/--power \(0.04\) must be larger than --alpha/);
  });
  it('messages can point into a plan file instead of at an option', () => {
    const name = (k: string): string => `planning value ${k} in kiln.plan.yaml`;
    expect(() => resolveInputs({ ...paired, sdDiff: 0 }, name)).toThrow(/planning value sdDiff in kiln.plan.yaml must be a positive number/);
  });
});

describe('size inputs: spreads and questions', () => {
  it('SD of differences from SD and correlation: sd * sqrt(2 (1 - rho))', () => {
    const { spec } = resolveInputs({ design: 'paired', difference: 1, sd: 4, rho: 0.5 });
    expect(spec.sdDiff).toBeCloseTo(4, 14);
    expect(resolveInputs({ design: 'paired', difference: 1, sd: 3, rho: 0.82 }).spec.sdDiff).toBeCloseTo(3 * Math.sqrt(0.36), 14);
  });
  it('effect sizes: d_z for pairs, d with --rho, d for groups', () => {
    expect(resolveInputs({ design: 'paired', effectSize: 0.4 }).spec).toMatchObject({ difference: 0.4, sdDiff: 1, standardized: true });
    const withRho = resolveInputs({ design: 'paired', effectSize: 0.4, rho: 0.75 }).spec;
    expect(withRho.difference / withRho.sdDiff).toBeCloseTo(0.4 / Math.sqrt(0.5), 14);
    expect(resolveInputs({ design: 'independent', effectSize: 0.4, sd: 5 }).spec).toMatchObject({ difference: 2, sd: 5, standardized: false });
  });
  it('--n with an effect asks for power; --n alone asks for the detectable difference', () => {
    expect(resolveInputs({ ...paired, n: 20 }).question).toBe('power');
    expect(resolveInputs({ design: 'paired', sdDiff: 3, n: 20 }).question).toBe('detectable-difference');
    expect(resolveInputs({ ...paired }).question).toBe('sample-size');
  });
  it('equivalence defaults the expected difference to 0 and says so', () => {
    const r = resolveInputs({ design: 'paired', sdDiff: 2, margin: 1 });
    expect(r.spec.difference).toBe(0);
    expect(r.notes.join(' ')).toMatch(/assumed to be 0/);
  });
  it('the minimum n respects the allocation ratio (each group needs 2)', () => {
    expect(() => resolveInputs({ design: 'independent', effectSize: 1, ratio: 0.25, n: 4 })).toThrow(/--n must be at least 5/);
  });
});
