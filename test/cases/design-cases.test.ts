/**
 * Every design case in cases/design/*.yaml: a short invented story, the answers, and the expected
 * design (family, kind, deciding rule), procedure and pre-declared fallback, plus warnings and
 * cautions that must appear. One loop runs them all; a second test proves that together they hit
 * every rule of the rule base (classification rules, procedure selections, statements, warnings
 * and cautions).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';
import { classify, loadRuleBase } from '../../src/engine/index.js';
import { decide } from '../../src/engine/decide.js';
import { walkAnswers } from '../../src/engine/facts.js';
import type { Answers } from '../../src/engine/types.js';
import { projectRoot } from '../../src/paths.js';
import { loadYaml } from '../../src/yaml/load.js';
import { checkPlanObject, planFromRecommendation } from '../../src/plan/index.js';

interface DesignCase {
  id: string;
  trade: string;
  story: string;
  answers: Answers;
  expect: {
    family: string;
    kind: string;
    rule: string;
    procedure: string | null;
    fallback: string | null;
    warnings?: string[];
    cautions?: string[];
  };
}

const dir = join(projectRoot(), 'cases', 'design');
const cases: { file: string; c: DesignCase }[] = readdirSync(dir)
  .filter((f) => f.endsWith('.yaml'))
  .sort()
  .map((file) => {
    const loaded = loadYaml(readFileSync(join(dir, file), 'utf8'), file);
    if (loaded.problems.length) throw new Error(`${file}: ${loaded.problems.map((p) => p.message).join('; ')}`);
    return { file, c: loaded.value as DesignCase };
  });
const rb = loadRuleBase();

function matched(answers: Answers) {
  const w = walkAnswers(rb, answers);
  const d = decide(rb, w.facts);
  return d;
}

describe('design cases', () => {
  test('there are at least 30 original cases from at least 8 trades', () => {
    expect(cases.length).toBeGreaterThanOrEqual(30);
    expect(new Set(cases.map(({ c }) => c.trade)).size).toBeGreaterThanOrEqual(8);
    for (const { file, c } of cases) {
      expect(`${c.id}.yaml`, 'file name matches id').toBe(file);
      expect(c.story.length, `${file} has a story`).toBeGreaterThan(60);
    }
  });

  test.each(cases.map(({ file, c }) => [file, c] as const))('%s', (_file, c) => {
    const rec = classify(rb, c.answers);
    expect(rec.design.family).toBe(c.expect.family);
    expect(rec.design.kind).toBe(c.expect.kind);
    expect(rec.design.rule).toBe(c.expect.rule);
    expect(rec.procedure.id).toBe(c.expect.procedure);
    expect(rec.procedure.fallback).toBe(c.expect.fallback);
    // Every answer in the case is on the path: a stale answer would mean the story and the
    // answers disagree.
    expect(Object.keys(rec.answers).sort()).toEqual(Object.keys(c.answers).sort());
    const d = matched(c.answers);
    const warnings = d.warnings.map((w) => w.id);
    const cautions = d.cautions.map((w) => w.id);
    for (const w of c.expect.warnings ?? []) expect(warnings, `warning ${w}`).toContain(w);
    for (const w of c.expect.cautions ?? []) expect(cautions, `caution ${w}`).toContain(w);
    // A paired recommendation always states n as pairs and df = pairs - 1 for the t procedures.
    if (rec.procedure.id === 'paired-t' || rec.procedure.id === 'paired-equivalence') {
      expect(rec.procedure.nCounting).toMatch(/pairs/);
      expect(rec.procedure.df).toBe('df = pairs - 1');
    }
    if (rec.design.family !== 'other') {
      const first = String(c.answers.first_label);
      const second = String(c.answers.second_label);
      expect(rec.difference).toContain(`${first} minus`);
      expect(rec.difference).toContain(second);
      expect(rec.difference).toMatch(/a positive difference means/);
    } else {
      expect(rec.design.instead).toBeTruthy();
    }
    // A yes/no outcome has no "higher value": one-sided hypotheses speak of how common the event is.
    if (rec.design.family !== 'other' && c.answers.outcome_type === 'binary' && /higher$/.test(String(c.answers.direction))) {
      const words = `${rec.hypotheses.nullWords} ${rec.hypotheses.alternativeWords}`;
      expect(words).toMatch(/more common under/);
      expect(words).not.toMatch(/gives (no )?higher/);
    }
    // Whatever the rule base recommends must make a plan that passes 'tandem plan check'
    // (an equivalence aim with a rank, crossover or yes/no procedure carries its margin).
    if (rec.procedure.id !== null) expect(checkPlanObject(planFromRecommendation(rec)), 'plan problems').toEqual([]);
    if (c.answers.people_or_safety !== 'none') {
      expect(rec.cautions.join(' ')).toMatch(/does not replace a qualified statistician, an ethics review or a protocol's\s+pre-specified analysis plan/);
    }
  });

  test('together the cases hit every rule of the rule base', () => {
    const hit = new Set<string>();
    for (const { c } of cases) {
      const d = matched(c.answers);
      for (const x of [...d.rules, ...d.selections, ...d.differences, ...d.hypotheses, ...d.scope, ...d.warnings, ...d.cautions]) hit.add(x.id);
      d.conditions.forEach((x) => hit.add(`condition:${x}`));
    }
    const all = [
      ...rb.rules,
      ...rb.selections,
      ...rb.differences,
      ...rb.hypotheses,
      ...rb.scope,
      ...rb.warnings,
      ...rb.cautions,
    ].map((x) => x.id);
    const missing = all.filter((id) => !hit.has(id));
    expect(missing, 'rules no case reaches').toEqual([]);
    const conditionsMissing = [...rb.conditions.keys()].filter((id) => !hit.has(`condition:${id}`));
    expect(conditionsMissing, 'conditions no case shows').toEqual([]);
    const kinds = new Set(cases.map(({ c }) => c.expect.kind));
    expect([...rb.designs.keys()].filter((k) => !kinds.has(k)), 'designs no case reaches').toEqual([]);
    const procs = new Set(cases.flatMap(({ c }) => [c.expect.procedure, c.expect.fallback]));
    expect([...rb.procedures.keys()].filter((p) => !procs.has(p)), 'procedures no case uses').toEqual([]);
  });
});
