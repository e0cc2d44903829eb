/**
 * Checks a plan beyond its schema: the parts must agree with each other. A plan edited by hand
 * can pass the schema and still ask for something incoherent (a Welch t on a paired design, an
 * equivalence test with no margin, a groups layout for pairs). Each finding names the path of the
 * offending value so the reader can place it at a line and column.
 */
import type { ProblemCode } from '../problems.js';
import { PROCEDURES, proceduresOf, sensitivityAllowed } from './procedures.js';
import type { Plan } from './types.js';
import type { ProcedureId } from '../stats/types.js';

export interface PlanFinding {
  code: ProblemCode;
  /** Path of the offending value (or of the object missing a key). */
  path: (string | number)[];
  message: string;
  hint?: string;
}

/** Procedures without a separate equivalence form: an equivalence aim is judged by their interval. */
const MARGIN_BY_INTERVAL: readonly ProcedureId[] = ['mcnemar', 'two-proportions', 'signed-rank', 'rank-sum', 'crossover-t'];

export function semanticFindings(plan: Plan): PlanFinding[] {
  const out: PlanFinding[] = [];
  const add = (code: ProblemCode, path: (string | number)[], message: string, hint?: string): void => {
    out.push({ code, path, message, ...(hint ? { hint } : {}) });
  };
  const family = plan.design.family as string;
  if (family !== 'paired' && family !== 'independent') return out; // the schema already said so
  const id = plan.procedure.id;
  const facts = PROCEDURES[id];

  if (facts.family !== family) {
    add('unknown-value', ['procedure', 'id'], `procedure '${id}' is for ${facts.family === 'paired' ? 'paired' : 'independent'} designs, but design.family is '${family}'`, `for a ${family} design use one of: ${proceduresOf(family).join(', ')}`);
  }

  // Margin: required by the equivalence procedures, meaningless elsewhere.
  if (facts.equivalence && plan.procedure.margin === undefined) {
    add('missing-key', ['procedure'], `procedure '${id}' is an equivalence test and needs procedure.margin`, 'a positive number in the outcome unit: equivalent means the difference lies within [-margin, +margin]');
  }
  // For an equivalence aim the rule base keeps the yes/no, rank and crossover procedures and
  // judges equivalence by their own 90% interval (rules/selections.yaml), so they carry the
  // margin too; only the t procedures, which have a separate equivalence form, take none.
  const margin = plan.procedure.margin;
  if (margin !== undefined && !facts.equivalence && !MARGIN_BY_INTERVAL.includes(id)) {
    add('unknown-key', ['procedure', 'margin'], `procedure.margin is only used for an equivalence aim: by the equivalence procedures (paired-equivalence, welch-equivalence) and, judged by their interval, by ${MARGIN_BY_INTERVAL.join(', ')}; not by '${id}'`, 'remove margin, or choose an equivalence procedure');
  }
  // Binary procedures judge equivalence by their interval for a difference of proportions.
  if (margin !== undefined && facts.binary && margin >= 1) {
    add('unknown-value', ['procedure', 'margin'], `procedure.margin ${margin} cannot bound a difference of two proportions`, 'a proportion between 0 and 1, e.g. 0.05 for five percentage points');
  }

  if (plan.sensitivity) {
    const allowed = sensitivityAllowed(id);
    if (!allowed.includes(plan.sensitivity.id)) {
      add(
        'unknown-value',
        ['sensitivity', 'id'],
        plan.sensitivity.id === id
          ? `the sensitivity analysis repeats the main procedure '${id}'`
          : `sensitivity '${plan.sensitivity.id}' does not fit the main procedure '${id}' (${family} design, ${facts.binary ? 'binary' : 'numeric'} outcome)`,
        allowed.length ? `allowed: ${allowed.join(', ')}, or null for none` : `'${id}' has no sensitivity alternative: use null`,
      );
    }
  }

  const layout = plan.data.layout;
  if (!facts.layouts.includes(layout)) {
    add('unknown-value', ['data', 'layout'], `data layout '${layout}' cannot be read by procedure '${id}'`, `allowed for '${id}': ${facts.layouts.join(', ')}`);
  }
  checkColumns(plan, add);

  const policy = family === 'paired' ? 'drop-incomplete-pairs' : 'drop-missing-values';
  if (plan.missingPolicy !== policy) {
    add('unknown-value', ['missingPolicy'], `missingPolicy '${plan.missingPolicy}' does not fit a ${family} design`, `use ${policy}`);
  }

  if (!facts.binary && plan.study.event !== undefined) {
    add('unknown-key', ['study', 'event'], `study.event is only used by binary procedures (mcnemar, two-proportions), not by '${id}'`, 'remove event, or choose a binary procedure');
  }
  if (plan.study.first === plan.study.second) {
    add('unknown-value', ['study', 'second'], `the two condition labels are both '${plan.study.first}'`, 'give the second condition its own label');
  }

  const seen = new Set<string>();
  plan.conditions.forEach((c, i) => {
    if (seen.has(c.id)) add('duplicate-id', ['conditions', i, 'id'], `condition id '${c.id}' appears more than once`);
    seen.add(c.id);
  });
  return out;
}

type Add = (code: ProblemCode, path: (string | number)[], message: string, hint?: string) => void;

/** Columns that must differ from each other, and levels that must tell the conditions apart. */
function checkColumns(plan: Plan, add: Add): void {
  const d = plan.data;
  const distinct = (keys: string[]): void => {
    const rec = d as unknown as Record<string, string | undefined>;
    for (let i = 0; i < keys.length; i++) {
      for (let j = 0; j < i; j++) {
        const a = rec[keys[j]];
        if (a !== undefined && a === rec[keys[i]]) {
          add('unknown-value', ['data', keys[i]], `data.${keys[i]} and data.${keys[j]} name the same column '${a}'`, 'each role needs its own column');
        }
      }
    }
  };
  switch (d.layout) {
    case 'wide':
      distinct(['id', 'first', 'second']);
      if (d.pairBy === 'id' && d.id === undefined) add('missing-key', ['data'], 'data.pairBy is id but data.id (the id column) is missing', 'name the id column, or use pairBy: row-order when each row is one unit and there is no id column');
      break;
    case 'long':
      distinct(['id', 'condition', 'value']);
      if (d.firstLevel === d.secondLevel) add('unknown-value', ['data', 'secondLevel'], `data.firstLevel and data.secondLevel are both '${d.firstLevel}'`, 'the two values of the condition column');
      break;
    case 'groups':
      distinct(['id', 'group', 'value']);
      if (d.firstLevel === d.secondLevel) add('unknown-value', ['data', 'secondLevel'], `data.firstLevel and data.secondLevel are both '${d.firstLevel}'`, 'the two values of the group column');
      break;
    case 'columns':
      distinct(['first', 'second']);
      break;
    case 'crossover':
      distinct(['id', 'sequence', 'period1', 'period2']);
      if (d.firstThenSecond === d.secondThenFirst) add('unknown-value', ['data', 'secondThenFirst'], `data.firstThenSecond and data.secondThenFirst are both '${d.firstThenSecond}'`, 'the two values of the sequence column');
      break;
  }
}
