/**
 * The closed set of audit finding codes. Each code has one severity and one line of
 * documentation; `tandem audit` never emits a code that is not listed here (a test checks it).
 *
 * Severities: `error` means the reported result cannot stand as written (the design was analysed
 * with the wrong procedure, or the numbers contradict each other); `warning` means the result may
 * stand but the reader is misled or a known weakness is left unaddressed; `note` is information
 * for the reviewer. Exit code 1 when any error finding is present.
 *
 * To add a finding: add its code here with severity and doc, emit it from one check in
 * src/audit/check-*.ts, and add a test in test/audit/ plus, where it fits, a case in cases/audit/.
 */
export const FINDING_CODES = {
  // The design against the procedure (study facts classified by the rule base)
  'independent-test-on-paired': { severity: 'error', doc: 'an independent-groups procedure was used on paired measurements' },
  'paired-test-on-unmatched': { severity: 'error', doc: 'a paired procedure was used on groups whose members are not linked one to one' },
  'row-order-pairing': { severity: 'error', doc: 'pairs were formed by the order of rows, not by a link between the two measurements' },
  'matched-after': { severity: 'warning', doc: 'units were matched after the outcomes were collected, then analysed as pairs' },
  'crossover-plain-paired': { severity: 'warning', doc: 'a plain paired procedure on a two-period crossover whose periods were recorded' },
  'multiple-pairwise-timepoints': { severity: 'error', doc: 'several two-condition tests on the same units with more than two time points or conditions' },
  'pseudo-replication': { severity: 'error', doc: 'several measurements per unit (or units inside clusters) counted as independent units' },
  'design-outside-two-sample': { severity: 'error', doc: 'the study facts place the design outside a two-condition comparison' },
  'outcome-type-mismatch': { severity: 'error', doc: 'the procedure does not fit the type of outcome (e.g. a t procedure on a yes/no outcome)' },
  'procedure-not-recommended': { severity: 'note', doc: 'a procedure of the right family, but not the one the rule base recommends' },
  'procedure-unknown': { severity: 'note', doc: 'the procedure named in the record could not be mapped to a known procedure' },
  'design-unknown': { severity: 'note', doc: 'no study facts were given, so the design could not be checked' },
  // Counts and degrees of freedom
  'n-counts-observations': { severity: 'error', doc: 'n counts measurements instead of pairs in a paired analysis' },
  'n-inconsistent': { severity: 'warning', doc: 'the reported counts do not add up (n against n1 + n2, or the group summaries)' },
  'df-inconsistent': { severity: 'error', doc: 'the degrees of freedom do not fit the procedure and the counts' },
  // Recomputation from the reported numbers
  'p-inconsistent': { severity: 'error', doc: 'the p-value does not follow from the statistic, df and sidedness, even allowing for rounding' },
  'p-other-sidedness': { severity: 'error', doc: 'the p-value is the one-sided value reported as two-sided, or the reverse' },
  'p-impossible': { severity: 'error', doc: 'the p-value is outside (0, 1]' },
  'p-written-as-zero': { severity: 'note', doc: 'the p-value is written as zero; a p-value is never zero' },
  'statistic-inconsistent': { severity: 'error', doc: 'the test statistic does not follow from the estimate and its standard error or the group summaries' },
  'estimate-inconsistent': { severity: 'error', doc: 'the estimate does not equal the difference of the reported means in the stated direction' },
  'ci-inconsistent': { severity: 'error', doc: 'the interval does not follow from the estimate, its standard error and the confidence level' },
  'ci-excludes-estimate': { severity: 'error', doc: 'the estimate lies outside its own interval' },
  'ci-p-disagree': { severity: 'error', doc: 'the two-sided interval and the p-value lead to opposite decisions about the null value' },
  'statistic-estimate-sign': { severity: 'error', doc: 'the statistic and the estimate have opposite signs' },
  // Direction of subtraction and sidedness
  'sign-vs-direction': { severity: 'error', doc: 'the sign of the statistic or estimate contradicts the stated subtraction and one-sided alternative' },
  'one-sided-no-direction': { severity: 'error', doc: 'a one-sided test without a stated direction of subtraction' },
  'one-sided-not-planned': { severity: 'warning', doc: 'a one-sided test where the study facts expected any difference' },
  'alternative-vs-plan': { severity: 'error', doc: 'the one-sided alternative points the other way from the direction the study expected' },
  'direction-unstated': { severity: 'note', doc: 'the direction of subtraction is not stated, so the sign of the estimate cannot be read' },
  // Effect size
  'effect-size-formula': { severity: 'warning', doc: 'a pooled- or average-SD d reported with a paired procedure without saying which formula' },
  'effect-size-dz-independent': { severity: 'error', doc: 'a d_z (SD of differences) reported for independent groups, which have no differences' },
  'effect-size-inconsistent': { severity: 'warning', doc: 'the effect size does not follow from the other reported numbers by its stated formula' },
  'effect-size-unnamed': { severity: 'note', doc: 'an effect size without its formula' },
  // Equivalence
  'equivalence-smaller-p': { severity: 'error', doc: 'equivalence decided with the smaller of the two one-sided p-values instead of the larger' },
  'equivalence-decision': { severity: 'error', doc: 'the equivalence decision contradicts the one-sided p-values or the interval against the margin' },
  'equivalence-no-margin': { severity: 'error', doc: 'equivalence claimed without a stated margin' },
  'absence-as-equivalence': { severity: 'warning', doc: 'a non-significant difference read as "no difference" without an equivalence test' },
  // Procedure choice
  'pretest-selection': { severity: 'warning', doc: 'the procedure was chosen after a normality or equal-spread pre-test on the same data' },
  // With --data
  'data-duplicate-ids': { severity: 'error', doc: 'an id occurs more than once within one condition in the data' },
  'data-unmatched-ids': { severity: 'warning', doc: 'ids present under one condition only; those incomplete pairs were dropped as whole pairs' },
  'data-incomplete-kept': { severity: 'error', doc: 'the reported counts include values from incomplete pairs' },
  'data-reported-differs': { severity: 'error', doc: "the colleague's procedure recomputed on the data does not give the reported numbers" },
  'data-conclusion-changes': { severity: 'warning', doc: "the recommended procedure and the colleague's reach different decisions on the same data" },
} as const satisfies Record<string, { severity: 'error' | 'warning' | 'note'; doc: string }>;

export type FindingCode = keyof typeof FINDING_CODES;

export function isFindingCode(x: string): x is FindingCode {
  return Object.prototype.hasOwnProperty.call(FINDING_CODES, x);
}
