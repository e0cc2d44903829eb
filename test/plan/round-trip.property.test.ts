/**
 * Writing then reading a plan gives the same plan, for plans generated across every procedure,
 * layout and optional part, with arbitrary Unicode in the free text (quotes, colons, leading
 * spaces, line breaks, text that looks like numbers or booleans) and arbitrary finite numbers.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { checkPlanObject, checkPlanText, PROCEDURES, sensitivityAllowed, writePlanText, type Plan } from '../../src/plan/index.js';
import { PROCEDURE_IDS, type ProcedureId } from '../../src/stats/types.js';

const text = fc.string({ unit: 'binary', maxLength: 40 });
const nonEmpty = fc.string({ unit: 'binary', minLength: 1, maxLength: 30 });
const tricky = fc.constantFrom('yes', 'no', 'null', '~', '0x1A', '1e3', '.5', '-', '? a', '- b', '#c', 'a: b', ' lead', 'trail ', 'two\nlines', '"q"', "'s'", '@x', '`y`', '%z', '!tag', '&anchor', '*alias', '{}', '[]');
const label = fc.oneof(nonEmpty, tricky);
const finite = fc.double({ noNaN: true, noDefaultInfinity: true });
const kind = fc.stringMatching(/^[a-z][a-z0-9-]{0,15}$/);
const answerKey = fc.stringMatching(/^[a-z][a-z0-9_]{0,12}$/);
const answerValue = fc.oneof(label, finite, fc.boolean(), fc.integer());

/** Column or level names that stay distinct because each carries its role. */
const named = (role: string): fc.Arbitrary<string> => label.map((s) => `${role}:${s}`);

function dataFor(id: ProcedureId): fc.Arbitrary<Plan['data']> {
  const extras = fc.record({ missing: fc.array(text, { maxLength: 3 }), delimiter: fc.constantFrom(',', ';', '\t', 'auto') as fc.Arbitrary<',' | ';' | '\t' | 'auto'> }, { requiredKeys: [] });
  const layouts = fc.constantFrom(...PROCEDURES[id].layouts);
  return fc.tuple(layouts, extras, fc.boolean()).chain(([layout, extra, byId]) => {
    const m: fc.Arbitrary<Plan['data']> =
      layout === 'wide'
        ? fc.record({ first: named('a'), second: named('b'), id: named('id') }).map((r) => (byId ? { layout, ...r, pairBy: 'id' as const } : { layout, first: r.first, second: r.second, pairBy: 'row-order' as const }))
        : layout === 'long'
          ? fc.record({ id: named('id'), condition: named('c'), value: named('v'), firstLevel: named('1'), secondLevel: named('2') }).map((r) => ({ layout, ...r }))
          : layout === 'groups'
            ? fc.record({ group: named('g'), value: named('v'), firstLevel: named('1'), secondLevel: named('2'), id: named('id') }, { requiredKeys: ['group', 'value', 'firstLevel', 'secondLevel'] }).map((r) => ({ layout, ...r }))
            : layout === 'columns'
              ? fc.record({ first: named('a'), second: named('b') }).map((r) => ({ layout, ...r }))
              : fc.record({ sequence: named('s'), firstThenSecond: named('ab'), secondThenFirst: named('ba'), period1: named('p1'), period2: named('p2'), id: named('id') }, { requiredKeys: ['sequence', 'firstThenSecond', 'secondThenFirst', 'period1', 'period2'] }).map((r) => ({ layout, ...r }));
    return m.map((d) => ({ ...d, ...extra }) as Plan['data']);
  });
}

const planArb: fc.Arbitrary<Plan> = fc.constantFrom(...PROCEDURE_IDS).chain((id) => {
  const facts = PROCEDURES[id];
  const allowed = sensitivityAllowed(id);
  return fc.record(
    {
      title: nonEmpty,
      createdBy: text,
      created: text,
      unit: label,
      outcome: label,
      outcomeUnit: text,
      first: named('first'),
      second: named('second'),
      event: nonEmpty,
      kind,
      reasons: fc.array(text, { maxLength: 4 }),
      difference: nonEmpty,
      alternative: fc.constantFrom('two-sided', 'greater', 'less') as fc.Arbitrary<'two-sided' | 'greater' | 'less'>,
      confidence: fc.double({ min: 1e-9, max: 1 - 1e-9, noNaN: true }),
      nullValue: finite,
      margin: fc.double({ min: 1e-12, max: 1e12, noNaN: true }),
      binaryMargin: fc.option(fc.double({ min: 1e-6, max: 0.999, noNaN: true }), { nil: undefined }),
      sensitivity: allowed.length ? fc.option(fc.record({ id: fc.constantFrom(...allowed), why: text })) : fc.constant(null),
      hyp: fc.tuple(text, text, text, text),
      data: dataFor(id),
      conditions: fc.uniqueArray(fc.record({ id: nonEmpty, text, check: text, basis: text }, { requiredKeys: ['id', 'text', 'check'] }), { selector: (c) => c.id, maxLength: 4 }),
      scope: fc.record({ causal: fc.boolean(), generalize: fc.boolean(), text }),
      warnings: fc.array(text, { maxLength: 3 }),
      cautions: fc.array(text, { maxLength: 3 }),
      answers: fc.dictionary(answerKey, answerValue, { maxKeys: 8 }),
      planning: fc.record({ difference: finite, sd: fc.double({ min: 1e-9, max: 1e9, noNaN: true }), rho: fc.double({ min: -0.999, max: 0.999, noNaN: true }), alpha: fc.double({ min: 1e-6, max: 0.5, noNaN: true }), power: fc.double({ min: 0.01, max: 0.999, noNaN: true }), n: fc.integer({ min: 2, max: 1e6 }), attrition: fc.double({ min: 0, max: 0.9, noNaN: true }) }, { requiredKeys: [] }),
    },
    { requiredKeys: ['title', 'unit', 'outcome', 'first', 'second', 'kind', 'reasons', 'difference', 'alternative', 'confidence', 'nullValue', 'margin', 'binaryMargin', 'sensitivity', 'hyp', 'data', 'conditions', 'scope', 'warnings', 'cautions', 'answers'] },
  ).map((r): Plan => ({
    format: 'tandem-plan/1',
    title: r.title,
    ...(r.createdBy !== undefined ? { createdBy: r.createdBy } : {}),
    ...(r.created !== undefined ? { created: r.created } : {}),
    study: { unit: r.unit, outcome: r.outcome, ...(r.outcomeUnit !== undefined ? { outcomeUnit: r.outcomeUnit } : {}), first: r.first, second: r.second, ...(facts.binary && r.event !== undefined ? { event: r.event } : {}) },
    design: { family: facts.family, kind: r.kind, reasons: r.reasons },
    difference: r.difference,
    procedure: { id, alternative: r.alternative, confidence: r.confidence, nullValue: r.nullValue, ...(facts.equivalence ? { margin: r.margin } : facts.binary && r.binaryMargin !== undefined ? { margin: r.binaryMargin } : {}) },
    sensitivity: r.sensitivity,
    hypotheses: { nullSymbols: r.hyp[0], alternativeSymbols: r.hyp[1], nullWords: r.hyp[2], alternativeWords: r.hyp[3] },
    data: r.data,
    missingPolicy: facts.family === 'paired' ? 'drop-incomplete-pairs' : 'drop-missing-values',
    conditions: r.conditions,
    scope: r.scope,
    warnings: r.warnings,
    cautions: r.cautions,
    answers: r.answers,
    ...(r.planning !== undefined ? { planning: r.planning } : {}),
  }));
});

describe('plan round trip (property)', () => {
  it('every generated plan is valid as built', () => {
    fc.assert(
      fc.property(planArb, (plan) => {
        expect(checkPlanObject(plan)).toEqual([]);
      }),
      { numRuns: 200 },
    );
  });

  it('writing then reading gives the same plan, and writing it again the same bytes', () => {
    fc.assert(
      fc.property(planArb, (plan) => {
        const text = writePlanText(plan, 'study.plan.yaml');
        const back = checkPlanText(text, 'study.plan.yaml');
        expect(back.problems).toEqual([]);
        expect(back.plan).toEqual(plan);
        expect(writePlanText(back.plan!, 'study.plan.yaml')).toBe(text);
      }),
      { numRuns: 150 },
    );
  });
});
