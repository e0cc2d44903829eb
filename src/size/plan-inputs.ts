/**
 * Planning inputs from an analysis plan (format tandem-plan/1): the optional `planning` section,
 * the design family, the alternative and equivalence margin of the procedure, and the study's
 * words for the report. Pure: takes loaded YAML, returns values or positioned problems. The full
 * plan check is `tandem plan check`; here only what sizing needs is read, so a plan that is still
 * being drafted can be sized.
 */
import { InputError } from '../errors.js';
import type { Problem } from '../problems.js';
import { positionOf, type LoadedYaml } from '../yaml/load.js';
import type { RawKey, RawSizeInputs } from './inputs.js';

/** Keys of the planning section, in the order they are written back. */
export const PLANNING_KEYS = ['difference', 'sd', 'sd2', 'sdDiff', 'rho', 'effectSize', 'alpha', 'power', 'ratio', 'attrition', 'n', 'margin'] as const;

export interface PlanSizeInputs {
  raw: RawSizeInputs;
  /** Which inputs came from the plan (for messages that point at the file). */
  fromPlan: Set<RawKey>;
  context: { unit?: string; outcome?: string; outcomeUnit?: string; first?: string; second?: string };
  family: string;
}

const isObj = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

export function sizeInputsFromPlan(loaded: LoadedYaml): PlanSizeInputs {
  const file = loaded.file;
  const problems: Problem[] = [];
  const at = (path: string[]): { line: number; col: number } => positionOf(loaded, path);
  const v = loaded.value;
  if (!isObj(v)) throw new InputError(`${file} is not a tandem plan (expected a mapping with format: tandem-plan/1)`);
  if (v.format !== 'tandem-plan/1') {
    throw new InputError(`${file} is not a tandem plan this version reads`, [{ code: 'format-version', file, ...at(['format']), message: `format is ${JSON.stringify(v.format)}`, hint: 'expected tandem-plan/1' }]);
  }
  const design = isObj(v.design) ? v.design : {};
  const family = typeof design.family === 'string' ? design.family : '';
  const raw: RawSizeInputs = {};
  const fromPlan = new Set<RawKey>();
  if (family === 'paired' || family === 'independent') {
    raw.design = family;
    fromPlan.add('design');
  }
  const planning = v.planning;
  if (planning !== undefined && planning !== null && !isObj(planning)) {
    problems.push({ code: 'wrong-type', file, ...at(['planning']), message: 'planning must be a mapping of numbers (difference, sd, ...)' });
  } else if (isObj(planning)) {
    const allowed = new Set<string>(PLANNING_KEYS);
    for (const [k, val] of Object.entries(planning)) {
      if (!allowed.has(k)) {
        problems.push({ code: 'unknown-key', file, ...positionOf(loaded, ['planning', k], { key: true }), message: `unknown planning key '${k}'`, hint: `allowed: ${[...allowed].join(', ')}` });
      } else if (val === null || val === undefined) {
        continue;
      } else if (typeof val !== 'number' || !Number.isFinite(val)) {
        problems.push({ code: 'wrong-type', file, ...at(['planning', k]), message: `planning.${k} must be a number; got ${JSON.stringify(val)}` });
      } else {
        (raw as Record<string, number>)[k] = val;
        fromPlan.add(k as RawKey);
      }
    }
  }
  const proc = isObj(v.procedure) ? v.procedure : {};
  if (proc.alternative === 'two-sided' || proc.alternative === 'greater' || proc.alternative === 'less') {
    if (typeof proc.margin !== 'number') {
      raw.alternative = proc.alternative;
      fromPlan.add('alternative');
    }
  }
  if (raw.margin === undefined && typeof proc.margin === 'number' && proc.margin > 0) {
    raw.margin = proc.margin;
    fromPlan.add('margin');
  }
  if (problems.length) throw new InputError(`${file}: the planning section cannot be used`, problems);
  const study = isObj(v.study) ? v.study : {};
  const str = (x: unknown): string | undefined => (typeof x === 'string' && x.trim() !== '' ? x.trim() : undefined);
  return {
    raw,
    fromPlan,
    family,
    context: { unit: str(study.unit), outcome: str(study.outcome), outcomeUnit: str(study.outcomeUnit), first: str(study.first), second: str(study.second) },
  };
}
