/**
 * The completeness check: every reachable answer path must end in exactly one outcome. A rule
 * base with two rules for the same answers (ambiguous), one with answers no rule covers
 * (incomplete), and rules or questions that can never apply are each caught, with positions.
 */
import { describe, expect, test } from 'vitest';
import { checkRuleBase, loadRuleBase } from '../../src/engine/index.js';
import type { Problem } from '../../src/problems.js';
import { lineOf, TINY, writeRules } from './tiny-rules.js';

const checkOf = (files: Record<string, string>) => checkRuleBase(loadRuleBase(writeRules(files)));
const codes = (ps: Problem[]) => ps.map((p) => p.code);

describe('checkRuleBase on a tiny rule base', () => {
  test('the tiny rule base is complete and unambiguous', () => {
    const r = checkOf({});
    expect(r.problems).toEqual([]);
    // layout=same: size in {blank, 5, 6, 9, 10} (both sides of the thresholds 6 and 10) x 2
    // directions; layout=different: 2 directions.
    expect(r.paths).toBe(12);
    expect(r.outcomes).toEqual({ staves: 10, barrels: 2 });
    expect(r.procedureCounts).toEqual({ 'signed-rank': 8, 'paired-t': 2, 'welch-t': 2 });
  });

  test('two rules holding for the same answers are reported as ambiguous, at the first rule', () => {
    const text = TINY['designs.yaml'] + `  - id: rule-also-staves\n    when: { fact: layout, equals: same }\n    design: barrels\n    reasons: [again]\n`;
    const r = checkOf({ 'designs.yaml': text });
    const p = r.problems.find((x) => x.code === 'ambiguous')!;
    expect(p.message).toContain("'rule-staves' and 'rule-also-staves'");
    expect(p.message).toContain('layout=same');
    expect(p.line).toBe(lineOf(text, 'id: rule-staves'));
    expect(p.file).toMatch(/designs\.yaml$/);
  });

  test('answers that no selection covers are reported as incomplete, with an example path', () => {
    const text = TINY['procedures.yaml'].replace('when: { fact: design_family, equals: independent }', 'when: { all: [{ fact: design_family, equals: independent }, { fact: direction, equals: first-higher }] }');
    const r = checkOf({ 'procedures.yaml': text });
    const p = r.problems.find((x) => x.code === 'incomplete')!;
    expect(p.message).toMatch(/no procedure selection holds for: .*layout=different.*direction=any-difference/);
  });

  test('the boundary value between two number rules is enumerated (a gap at exactly 10 is found)', () => {
    const text = TINY['procedures.yaml'].replace('{ not: { fact: size, gte: 10 } }', '{ fact: size, lt: 10 }').replace('{ fact: size, gte: 10 }', '{ fact: size, gt: 10 }');
    const r = checkOf({ 'procedures.yaml': text });
    const msgs = r.problems.filter((p) => p.code === 'incomplete').map((p) => p.message);
    expect(msgs.some((m) => m.includes('size=10'))).toBe(true);
    // a blank size satisfies neither "lt 10" nor "gt 10" either
    expect(msgs.some((m) => m.includes('size=(blank)'))).toBe(true);
  });

  test('a rule that can never hold, and a question never asked, are reported at their lines', () => {
    const d = TINY['designs.yaml'] + `  - id: rule-impossible\n    when: { all: [{ fact: layout, equals: same }, { fact: layout, equals: different }] }\n    design: barrels\n    reasons: [never]\n`;
    const q = TINY['questions.yaml'] + `  - id: wood\n    type: text\n    ask_when: { all: [{ fact: layout, equals: same }, { fact: layout, equals: different }] }\n    text: Which oak?\n    help: e.g. French oak.\n`;
    const r = checkOf({ 'designs.yaml': d, 'questions.yaml': q });
    const unreachable = r.problems.find((p) => p.code === 'unreachable' && p.message.includes('rule-impossible'))!;
    expect(unreachable.line).toBe(lineOf(d, 'id: rule-impossible'));
    const never = r.problems.find((p) => p.code === 'never-asked')!;
    expect(never.message).toContain("question 'wood'");
    expect(never.line).toBe(lineOf(q, 'id: wood'));
  });

  test('warnings, designs and procedures never used are reported', () => {
    const s = TINY['statements.yaml'] + `  - id: warn-never\n    when: { fact: size, gt: 1000000 }\n    text: never\n`;
    const s2 = s.replace('  - id: warn-never\n    when: { fact: size, gt: 1000000 }', '  - id: warn-never\n    when: { all: [{ fact: layout, equals: different }, { fact: size, answered: true }] }');
    const p = TINY['procedures.yaml'].replace('fallback: null', 'fallback: null\n  - id: sel-never\n    when: { all: [{ fact: design_family, equals: independent }, { fact: layout, equals: same }] }\n    procedure: welch-t\n    fallback: null');
    const dz = TINY['designs.yaml'].replace('designs:\n', 'designs:\n  - { kind: casks, family: paired, label: casks, description: never used. }\n');
    const r = checkOf({ 'statements.yaml': s2, 'procedures.yaml': p, 'designs.yaml': dz });
    const msgs = r.problems.map((x) => x.message);
    expect(msgs).toContain("warning 'warn-never' never applies on any answer path");
    expect(msgs).toContain("procedure selection 'sel-never' never applies on any answer path");
    expect(msgs).toContain("design 'casks' never applies on any answer path");
    expect(codes(r.problems).every((c) => c === 'unreachable')).toBe(true);
  });

  test('a ratio threshold is reached from both sides (values around the other operand)', () => {
    const q = TINY['questions.yaml'] + `  - id: stock\n    type: number\n    integer: true\n    min: 2\n    ask_when: { fact: size, answered: true }\n    text: How many barrels in the cellar?\n    help: e.g. 300.\n`;
    const extra = `derived:\n  - id: share\n    description: sampled share of the cellar\n    ratio: [size, stock]\nwarnings:\n  - id: warn-share\n    when: { fact: share, gt: 0.1 }\n    text: 'More than a tenth of the cellar ({size} of {stock}).'\n  - id: warn-small-share\n    when: { fact: share, lte: 0.1 }\n    text: 'At most a tenth.'\n`;
    const r = checkOf({ 'questions.yaml': q, 'derived.yaml': extra });
    expect(r.problems).toEqual([]);
  });

  test('a predicate nobody refers to is reported', () => {
    const extra = `predicates:\n  - id: lonely\n    description: unused\n    when: { fact: layout, equals: same }\n`;
    const r = checkOf({ 'predicates.yaml': extra });
    expect(r.problems.map((p) => p.message)).toContain("predicate 'lonely' is never referred to");
  });
});

describe('checkRuleBase on the bundled rule base', () => {
  test('every answer path ends in exactly one outcome, and everything is reachable', () => {
    const rb = loadRuleBase();
    const r = checkRuleBase(rb);
    expect(r.problems).toEqual([]);
    expect(r.paths).toBeGreaterThan(1000);
    expect(Object.keys(r.outcomes).sort()).toEqual([...rb.designs.keys()].sort());
    expect(Object.keys(r.procedureCounts).sort()).toEqual([...rb.procedures.keys(), 'none'].sort());
  });
});
