import { it } from 'vitest';
import { classify, loadRuleBase } from '../../src/engine/index.js';
import { readFileSync } from 'node:fs';
import { parse } from 'yaml';

it('scratch', () => {
  const rb = loadRuleBase();
  const sets = parse(readFileSync('/tmp/answersets.yaml', 'utf8')) as Record<string, Record<string, unknown>>;
  for (const [name, a] of Object.entries(sets)) {
    try {
      const r = classify(rb, a as never);
      console.log(name, '=>', r.design.family, r.design.kind, r.procedure.id, r.procedure.fallback, r.procedure.alternative, r.procedure.margin, '|', r.cautions.length, 'cautions');
    } catch (e: any) {
      console.log(name, 'ERR', e.message);
    }
  }
});
