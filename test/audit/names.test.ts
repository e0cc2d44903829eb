/** Procedure names as colleagues write them, mapped to tandem's ids. */
import { describe, expect, it } from 'vitest';
import { mapProcedureName } from '../../src/audit/procedure-names.js';

const cases: [string, string | undefined, string | undefined][] = [
  ['paired-t', 'paired-t', 'paired'],
  ['Paired samples t-test', 'paired-t', 'paired'],
  ['dependent t test', 'paired-t', 'paired'],
  ['t test on the differences', 'paired-t', 'paired'],
  ["Welch's t-test", 'welch-t', 'independent'],
  ['t-test assuming unequal variances', 'welch-t', 'independent'],
  ["Student's two-sample t", 'pooled-t', 'independent'],
  ['independent t-test, equal variances assumed', 'pooled-t', 'independent'],
  ['independent samples t-test', undefined, 'independent'],
  ['Mann-Whitney U', 'rank-sum', 'independent'],
  ['Wilcoxon rank-sum', 'rank-sum', 'independent'],
  ['Wilcoxon signed-rank test', 'signed-rank', 'paired'],
  ["McNemar's test", 'mcnemar', 'paired'],
  ["Fisher's exact test", 'two-proportions', 'independent'],
  ['chi-square test of two proportions', 'two-proportions', 'independent'],
  ['TOST (paired)', 'paired-equivalence', 'paired'],
  ['two one-sided tests', 'welch-equivalence', 'independent'],
  ['2x2 crossover analysis', 'crossover-t', 'crossover'],
  ['repeated-measures ANOVA', undefined, 'other'],
  ['the usual test', undefined, undefined],
];

describe('mapping procedure names', () => {
  for (const [name, id, family] of cases) {
    it(`"${name}" -> ${id ?? '(no id)'} / ${family ?? '(unknown)'}`, () => {
      const m = mapProcedureName(name);
      expect(m.id).toBe(id);
      expect(m.family).toBe(family);
    });
  }
});
