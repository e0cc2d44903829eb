/**
 * Mapping the procedure named in a colleague's report to one of tandem's procedure ids.
 *
 * Reports name procedures in many ways ("dependent-samples t", "Student's t for two groups",
 * "Mann-Whitney U"). The record may give an id directly; otherwise the name is matched, after
 * lower-casing and removing punctuation, against the patterns below, most specific first. A name
 * that matches nothing still tells the family when it says "paired" or "independent".
 *
 * Example: mapProcedureName("Welch's unequal-variances t") -> { id: 'welch-t', family: 'independent' }.
 */
import { isProcedureId, procedureDesign } from '../stats/index.js';
import type { ProcedureId } from '../stats/types.js';

export type ProcedureFamily = 'paired' | 'independent' | 'crossover' | 'other';

interface Pattern {
  test: RegExp;
  id?: ProcedureId;
  family: ProcedureFamily;
}

/** Most specific first. Patterns run on the normalized name: lower case, words separated by one space. */
const PATTERNS: Pattern[] = [
  { test: /\b(tost|two one sided|equivalence)\b.*\b(paired|dependent|within|repeated|matched)\b|\b(paired|dependent|within|matched)\b.*\b(tost|two one sided|equivalence)\b/, id: 'paired-equivalence', family: 'paired' },
  { test: /\b(tost|two one sided|equivalence)\b/, id: 'welch-equivalence', family: 'independent' },
  { test: /\bcross ?over\b|\bhills\b.*\barmitage\b|\bperiod differences?\b/, id: 'crossover-t', family: 'crossover' },
  { test: /\bmcnemar\b/, id: 'mcnemar', family: 'paired' },
  { test: /\bsigned rank\b|\bwilcoxon\b.*\b(paired|matched|signed)\b|\bsign ranked\b/, id: 'signed-rank', family: 'paired' },
  { test: /\bmann whitney\b|\brank sum\b|\bwilcoxon mann\b|\bu test\b|\bwilcoxon\b.*\b(independent|two sample|unpaired)\b/, id: 'rank-sum', family: 'independent' },
  { test: /\bfisher\b|\bproportions?\b|\bchi square\b|\bchi squared\b|\bz test for\b/, id: 'two-proportions', family: 'independent' },
  { test: /\bwelch\b|\bunequal variances?\b|\bsatterthwaite\b/, id: 'welch-t', family: 'independent' },
  { test: /\bpooled\b|\bequal variances?\b|\bstudent s?\b.*\b(two sample|independent|unpaired|groups?)\b/, id: 'pooled-t', family: 'independent' },
  { test: /\b(paired|dependent|matched|repeated measures|within subjects?|related)\b.*\bt\b|\bt\b.*\b(paired|dependent|matched|related)\b|\bon the differences\b/, id: 'paired-t', family: 'paired' },
  { test: /\b(independent|two sample|unpaired|between groups?)\b.*\bt\b|\bt\b.*\b(independent|two sample|unpaired)\b/, family: 'independent' },
  { test: /\banova\b|\bregression\b|\bmixed model\b|\bkruskal\b|\bfriedman\b/, family: 'other' },
  { test: /\b(paired|dependent|matched)\b/, family: 'paired' },
  { test: /\b(independent|unpaired|two groups?)\b/, family: 'independent' },
];

function normalizeName(name: string): string {
  return name
    .toLowerCase()
    .replace(/[’']s\b/g, '')
    .replace(/[’']/g, '')
    .replace(/[^a-z0-9]+/g, ' ')
    .trim();
}

/** The id and family for a procedure as written; `id` is absent when only the family is known. */
export function mapProcedureName(name: string): { id?: ProcedureId; family?: ProcedureFamily } {
  const trimmed = name.trim();
  if (isProcedureId(trimmed)) return { id: trimmed, family: procedureDesign(trimmed) };
  const norm = normalizeName(trimmed);
  for (const p of PATTERNS) {
    if (p.test.test(norm)) return p.id ? { id: p.id, family: p.family } : { family: p.family };
  }
  return {};
}

/** The family of a procedure id: paired, independent or crossover. */
export function familyOf(id: ProcedureId): ProcedureFamily {
  return procedureDesign(id);
}

/** Procedures whose statistic is a t with degrees of freedom. */
export const T_PROCEDURES: readonly ProcedureId[] = ['paired-t', 'welch-t', 'pooled-t', 'crossover-t', 'paired-equivalence', 'welch-equivalence'];

/** Procedures for continuous outcomes (t and rank procedures); the rest are for yes/no outcomes. */
export const BINARY_PROCEDURES: readonly ProcedureId[] = ['mcnemar', 'two-proportions'];

/** Plain names for messages and reports (no run-together test names). */
export const PROCEDURE_LABEL: Record<ProcedureId, string> = {
  'paired-t': 'paired t on the differences',
  'welch-t': 'Welch two-sample t',
  'pooled-t': 'pooled two-sample t (equal spreads assumed)',
  'signed-rank': 'Wilcoxon signed-rank on the differences',
  'rank-sum': 'Wilcoxon-Mann-Whitney rank-sum',
  mcnemar: 'McNemar test on the discordant pairs',
  'two-proportions': 'difference of two proportions',
  'crossover-t': '2x2 crossover analysis (period differences by sequence)',
  'paired-equivalence': 'paired equivalence by two one-sided tests',
  'welch-equivalence': 'Welch equivalence by two one-sided tests',
};
