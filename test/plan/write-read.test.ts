import { describe, expect, it } from 'vitest';
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { OutputError, InputError } from '../../src/errors.js';
import { schemasDir } from '../../src/paths.js';
import { parsePlanText, planFromRecommendation, readPlan, savePlan, writePlanText, type Plan } from '../../src/plan/index.js';
import { ALL_PLANNABLE, splitLoaves } from './recommendations.js';

const CREATED = '2025-03-01T10:00:00.000Z';

describe('writing and reading a plan', () => {
  for (const [name, make] of Object.entries(ALL_PLANNABLE)) {
    it(`gives the same plan back (${name})`, () => {
      const plan = planFromRecommendation(make(), { created: CREATED });
      const text = writePlanText(plan, '/srv/studies/plan.yaml');
      expect(parsePlanText(text, 'plan.yaml')).toEqual(plan);
    });
  }

  it('starts with the editor modeline naming the installed schema relative to the plan file', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tandem-plan-'));
    const path = join(dir, 'sub', 'loaves.plan.yaml');
    const text = writePlanText(planFromRecommendation(splitLoaves()), path);
    const first = text.split('\n')[0];
    const rel = relative(join(dir, 'sub'), join(schemasDir(), 'plan-v1.schema.json')).split('\\').join('/');
    expect(first).toBe(`# yaml-language-server: $schema=${rel}`);
    expect(first).toMatch(/schemas\/plan-v1\.schema\.json$/);
  });

  it('puts the format line first among the keys, with comments explaining the sections', () => {
    const text = writePlanText(planFromRecommendation(splitLoaves()), 'plan.yaml');
    const keys = text.split('\n').filter((l) => /^[a-zA-Z]/.test(l));
    expect(keys[0]).toBe('format: tandem-plan/1');
    expect(keys.map((k) => k.split(':')[0])).toEqual(['format', 'title', 'createdBy', 'study', 'design', 'difference', 'procedure', 'sensitivity', 'hypotheses', 'data', 'missingPolicy', 'conditions', 'scope', 'warnings', 'cautions', 'answers']);
    expect(text).toMatch(/# EDIT the column names/);
    expect(text).toMatch(/# Sensitivity analysis declared now/);
  });

  it('writes the same bytes whatever order the plan object was built in', () => {
    const plan = planFromRecommendation(splitLoaves(), { created: CREATED });
    const shuffled = Object.fromEntries(Object.entries(plan).reverse()) as unknown as Plan;
    shuffled.procedure = Object.fromEntries(Object.entries(plan.procedure).reverse()) as Plan['procedure'];
    shuffled.data = Object.fromEntries(Object.entries(plan.data).reverse()) as Plan['data'];
    expect(writePlanText(shuffled, 'plan.yaml')).toBe(writePlanText(plan, 'plan.yaml'));
  });

  it('quotes values that YAML would otherwise read as numbers, booleans or null', () => {
    const rec = splitLoaves();
    rec.answers = { ...rec.answers, first_label: '12', second_label: 'true', unit: 'null', outcome: '0x1F' };
    const plan = planFromRecommendation(rec);
    expect(parsePlanText(writePlanText(plan, 'p.yaml'), 'p.yaml')).toEqual(plan);
  });
});

describe('saving a plan file', () => {
  it('writes atomically, refuses to replace an existing file without force, and replaces it with force', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tandem-plan-'));
    const path = join(dir, 'loaves.plan.yaml');
    writeFileSync(path, 'kept: true\n');
    const plan = planFromRecommendation(splitLoaves());
    await expect(savePlan(plan, path)).rejects.toThrow(OutputError);
    expect(readFileSync(path, 'utf8')).toBe('kept: true\n');
    await savePlan(plan, path, { force: true });
    expect(await readPlan(path)).toEqual(plan);
    expect(readdirSync(dir)).toEqual(['loaves.plan.yaml']); // no temporary file left behind
  });

  it('reports a missing plan file as bad input, naming the file', async () => {
    const path = join(tmpdir(), 'tandem-no-such-plan.yaml');
    await expect(readPlan(path)).rejects.toThrow(InputError);
    await expect(readPlan(path)).rejects.toThrow(/cannot read plan .*no such file/);
  });
});
