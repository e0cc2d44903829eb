/**
 * A tiny, self-contained rule base for tests, written to a fresh temporary directory. Each file's
 * text can be replaced or added to, so a test can break exactly one thing and look for the
 * problem at its line and column. The invented study: a cooper comparing two barrel toasts.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export const TINY: Record<string, string> = {
  'questions.yaml': `questions:
  - id: unit
    type: text
    text: What is one unit?
    help: e.g. a barrel.
  - id: first_label
    type: text
    text: First condition?
    help: e.g. heavy toast.
  - id: second_label
    type: text
    text: Second condition?
    help: e.g. light toast.
  - id: layout
    type: choice
    text: Same barrel or different barrels?
    help: How the values arise.
    choices:
      - { value: same, label: same barrel, help: e.g. two staves of one barrel. }
      - { value: different, label: different barrels, help: e.g. separate barrels. }
  - id: size
    type: number
    integer: true
    min: 2
    optional: true
    ask_when: { fact: layout, equals: same }
    text: How many barrels?
    help: e.g. 12.
  - id: direction
    type: choice
    text: Direction?
    help: What you set out to show.
    choices:
      - { value: any-difference, label: any, help: either way. }
      - { value: first-higher, label: first higher, help: first is higher. }
`,
  'designs.yaml': `designs:
  - { kind: staves, family: paired, label: two staves of one barrel, description: paired. }
  - { kind: barrels, family: independent, label: separate barrels, description: independent. }
rules:
  - id: rule-staves
    when: { fact: layout, equals: same }
    design: staves
    reasons: ['Each {unit} gives two values.']
  - id: rule-barrels
    when: { fact: layout, equals: different }
    design: barrels
    reasons: ['Each {unit} gives one value.']
`,
  'procedures.yaml': `procedures:
  - id: paired-t
    name: paired t
    applies: paired
    n_counting: n = pairs
    df: df = pairs - 1
    estimate: mean difference
    parameter: { symbol: μd, words: the mean difference }
    conditions: [shape]
    references: [Student (1908)]
  - id: signed-rank
    name: signed-rank
    applies: paired, skewed
    n_counting: n = pairs
    df: none
    estimate: Hodges-Lehmann
    parameter: { symbol: θd, words: the centre of the differences }
    conditions: [shape]
    references: [Wilcoxon (1945)]
  - id: welch-t
    name: Welch t
    applies: independent
    n_counting: n1, n2
    df: Welch
    estimate: difference of means
    parameter: { symbol: μ1 − μ2, words: the difference of means }
    conditions: []
    references: [Welch (1947)]
selections:
  - id: sel-small
    when: { all: [{ fact: design_family, equals: paired }, { not: { fact: size, gte: 10 } }] }
    procedure: signed-rank
    fallback: paired-t
  - id: sel-large
    when: { all: [{ fact: design_family, equals: paired }, { fact: size, gte: 10 }] }
    procedure: paired-t
    fallback: signed-rank
  - id: sel-independent
    when: { fact: design_family, equals: independent }
    procedure: welch-t
    fallback: null
conditions:
  - id: shape
    text: The differences are roughly symmetric.
    check: Plot them.
`,
  'statements.yaml': `differences:
  - id: diff
    text: Each difference is {first_label} minus {second_label}; a positive difference means {first_label} was higher.
hypotheses:
  - id: hyp-two
    when: { fact: direction, equals: any-difference }
    alternative: two-sided
    null_symbols: 'H0: {param} = 0'
    alternative_symbols: 'Ha: {param} ≠ 0'
    null_words: '{param_words} is zero'
    alternative_words: '{param_words} is not zero'
  - id: hyp-greater
    when: { fact: direction, equals: first-higher }
    alternative: greater
    null_symbols: 'H0: {param} = 0'
    alternative_symbols: 'Ha: {param} > 0'
    null_words: '{param_words} is zero'
    alternative_words: '{param_words} is above zero'
scope:
  - id: scope-all
    causal: false
    generalize: false
    text: These barrels only.
warnings:
  - id: warn-few
    when: { fact: size, lt: 6 }
    text: Only {size} barrels.
`,
};

/** Writes the tiny rule base (with replaced or extra files) to a new temp directory. */
export function writeRules(files: Record<string, string> = {}, base: Record<string, string> = TINY): string {
  const dir = mkdtempSync(join(tmpdir(), 'tandem-rules-'));
  for (const [name, text] of Object.entries({ ...base, ...files })) writeFileSync(join(dir, name), text);
  return dir;
}

/** The 1-based line of the first occurrence of `needle` in `text` (to assert positions). */
export function lineOf(text: string, needle: string): number {
  const i = text.indexOf(needle);
  if (i < 0) throw new Error(`'${needle}' not in text`);
  return text.slice(0, i).split('\n').length;
}
