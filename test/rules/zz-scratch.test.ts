import { test } from 'vitest';
import { loadRuleBase, checkRuleBase } from '../../src/engine/index.js';
import { formatProblem } from '../../src/problems.js';
import { InputError } from '../../src/errors.js';
test('scratch', () => {
  try {
    const rb = loadRuleBase();
    const t0 = Date.now();
    const r = checkRuleBase(rb);
    console.log('ms', Date.now() - t0, JSON.stringify({ ...r, problems: undefined }, null, 1));
    for (const p of r.problems) console.log(formatProblem(p));
  } catch (e) {
    if (e instanceof InputError) { console.log(e.message); for (const p of e.problems) console.log(formatProblem(p)); }
    else throw e;
  }
});
