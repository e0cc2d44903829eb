/**
 * The design against the procedure. The study facts are classified by the same rule base the
 * interview uses (or the reviewer states the design); the procedure the colleague used must belong
 * to that design's family. A paired procedure on unlinked groups invents a correlation; an
 * independent procedure on pairs throws the pairing away and counts each unit twice.
 *
 * References: Hills and Armitage (1979) for the crossover; Hurlbert (1984) for pseudo-replication;
 * Bland and Altman (1995) on many comparisons on the same units.
 */
import { unitNames, type AuditContext, type Collector } from './context.js';
import { BINARY_PROCEDURES, PROCEDURE_LABEL } from './procedure-names.js';

const PAIRED_PROCEDURES = ['paired-t', 'signed-rank', 'paired-equivalence'];

export function checkDesign(ctx: AuditContext, out: Collector): void {
  const { design, r, rec } = ctx;
  const { one: unit, many: units } = unitNames(ctx);
  const recommended = ctx.recommended ? PROCEDURE_LABEL[ctx.recommended] : undefined;
  const instead = recommended ? `Re-run the analysis with the ${recommended}` : 'Re-run the analysis with a procedure for this design';

  if (!r.procedureText) {
    out.add('procedure-unknown', 'The record does not say which procedure the colleague used, so the procedure cannot be checked against the design.', 'Add reported.procedure (an id such as paired-t or the name the report uses).');
  } else if (!ctx.usedFamily) {
    out.add('procedure-unknown', `The procedure "${r.procedureText}" could not be matched to a known two-condition procedure.`, 'Write reported.procedure as one of the ids paired-t, welch-t, pooled-t, signed-rank, rank-sum, mcnemar, two-proportions, crossover-t, paired-equivalence, welch-equivalence.');
  }
  if (!design) {
    const noted = ctx.recommendationNote && ctx.record.answers;
    out.add('design-unknown',
      noted ? `The study facts could not be classified: ${ctx.recommendationNote}. Whether the data are paired or independent was not checked.` : 'The record holds no study facts (answers, an answers file or a plan), so whether the data are paired or independent could not be checked.',
      noted ? 'Complete the answers (tandem advise --answers FILE lists what is missing), or state study.design.' : 'Add study.answers with the interview answers, or study.answersFile / study.planFile, or at least study.design.');
  }
  const kind = design?.kind ?? '';
  const fam = ctx.usedFamily;
  const usedPaired = fam === 'paired' || fam === 'crossover';

  if ((r.comparisons !== undefined && r.comparisons > 1) || kind === 'more-than-two') {
    const k = r.comparisons ?? 0;
    const inflation = k > 1 ? ` With ${k} tests at ${ctx.alpha} each, the chance of at least one false alarm when nothing differs is up to ${(1 - Math.pow(1 - ctx.alpha, k)).toFixed(2)}.` : '';
    out.add('multiple-pairwise-timepoints',
      `The ${units} were measured at more than two time points or under more than two conditions, but the analysis compares them two at a time.${inflation} Separate pairwise tests also ignore the pattern over time.`,
      'Analyse all time points together (a repeated-measures or mixed model, or one pre-declared summary per unit such as the slope or the area under the curve), then compare pairs only as pre-planned contrasts with an adjusted level.');
  }
  if (kind === 'clustered' || r.repeatedPerUnit) {
    out.add('pseudo-replication',
      `Several measurements come from the same ${unit} (or the ${units} sit inside clusters), yet they were entered as if each were an independent ${unit}. The standard error is then too small and the p-value too small; n is inflated.`,
      `Reduce to one value per ${unit} (for instance the ${unit}'s mean) and count ${units}, or use a model with a random effect for the ${unit} or cluster.`);
  }
  if (design?.family === 'paired' && fam === 'independent') {
    out.add('independent-test-on-paired',
      `The study facts describe a paired design (${design.label ?? kind}): each ${unit} contributes a measurement under both conditions. ${ctx.usedLabel} treats the two sets as unrelated, so it ignores the pairing: the standard error is wrong (too large when pair members move together), n counts measurements instead of ${units}, and df are too many.`,
      `${instead}${instead.endsWith('on the differences') ? '' : ' on the differences'}${ctx.subtraction ? ` (${ctx.subtraction})` : ''}, with n = number of complete pairs${ctx.recommended === 'paired-t' || !ctx.recommended ? ' and df = pairs - 1' : ''}.`);
  }
  if (design?.family === 'independent' && usedPaired) {
    out.add('paired-test-on-unmatched',
      `The study facts describe independent groups (${design.label ?? kind}): no ${unit} in one condition is linked to a particular ${unit} in the other. ${ctx.usedLabel} needs such a link; without one, the "pairs" depend on the order of the rows and the result can change by re-sorting.`,
      `${recommended ? `Re-run the analysis with the ${recommended}` : "Re-run the analysis with a procedure for independent groups (Welch's t is the usual default)"}, with n1 and n2 counted per group.`);
  }
  // Pairing findings concern analyses that used the pairs (or whose procedure is not known).
  const pairsUsed = usedPaired || fam === undefined;
  if ((r.pairing === 'row-order' && pairsUsed) || (kind === 'arbitrary-pairing' && usedPaired)) {
    const noLink = kind === 'arbitrary-pairing' || design?.family === 'independent';
    out.add('row-order-pairing',
      noLink
        ? `The two sets of measurements were put side by side by row position, but nothing links a value in one set to a value in the other. Such "pairs" are invented: another sorting gives another result.`
        : `The pairs were formed by row position instead of by the ${unit}'s identifier. If either column was sorted, filtered or had a row removed, the pairs no longer belong to the same ${unit}.`,
      noLink
        ? 'Analyse the two sets as independent groups (Welch two-sample t by default).'
        : `Join the two measurements by the ${unit}'s identifier, drop incomplete pairs as whole pairs, and re-run the paired analysis.`);
  }
  if ((kind === 'matched-after' && usedPaired) || (r.pairing === 'matched-after' && pairsUsed)) {
    out.add('matched-after',
      `The ${units} were matched after the outcomes were collected. A match made while the outcomes can be seen can follow them, so the pairing may build in the very difference being tested; and ${units} left without a match are dropped.`,
      'Report the analysis as independent groups (with the matching variable as a covariate if needed), or state plainly that the matching was done after the fact and show that the result holds without it.');
  }
  if (kind === 'crossover' && ctx.used && PAIRED_PROCEDURES.includes(ctx.used) && r.periodUsed !== true) {
    out.add('crossover-plain-paired',
      `The ${units} received both conditions in two periods with the order recorded (a two-period crossover), but ${ctx.usedLabel} ignores the period. A period effect (learning, wear, season) then inflates the spread of the differences and, with unequal sequence groups, biases the estimate.`,
      'Use the 2x2 crossover analysis (Hills and Armitage 1979): compare the period-1-minus-period-2 differences between the two sequence groups; it gives the treatment effect with the period effect removed.');
  }
  if (design?.family === 'other' && !['more-than-two', 'clustered', 'arbitrary-pairing'].includes(kind)) {
    const rb = rec?.design;
    out.add('design-outside-two-sample',
      `The study facts place this study outside a two-condition comparison (${rb?.label ?? kind}). No two-sample procedure answers its question as reported.`,
      rb?.instead ?? 'See what the interview recommends instead for this design (tandem advise).');
  }
  checkOutcomeType(ctx, out);
  if (rec?.procedure.id && ctx.used && ctx.used !== rec.procedure.id && rec.procedure.fallback !== ctx.used && design && fam === design.family && out.findings.every((f) => f.code === 'procedure-unknown' || f.code === 'design-unknown')) {
    out.add('procedure-not-recommended',
      `${ctx.usedLabel} fits the design's family, but the recommended procedure is the ${PROCEDURE_LABEL[rec.procedure.id]}${ctx.used === 'pooled-t' && rec.procedure.id === 'welch-t' ? ': the pooled t assumes equal spreads in both groups and can mislead when spreads and group sizes differ' : ''}.`,
      `Report the ${PROCEDURE_LABEL[rec.procedure.id]} as the main result, or say why the other procedure was pre-declared.`);
  }
}

/** A t or rank procedure on a yes/no outcome, or a proportion procedure on a measured one. */
function checkOutcomeType(ctx: AuditContext, out: Collector): void {
  if (!ctx.used) return;
  const answers = ctx.record.answers ?? {};
  const recId = ctx.rec?.procedure.id;
  const binaryStudy = recId ? BINARY_PROCEDURES.includes(recId) : answers.outcome_type !== undefined ? answers.outcome_type === 'binary' : undefined;
  if (binaryStudy === undefined) return;
  const binaryUsed = BINARY_PROCEDURES.includes(ctx.used);
  if (binaryStudy === binaryUsed) return;
  out.add('outcome-type-mismatch',
    binaryStudy
      ? `The outcome is yes/no, but ${ctx.usedLabel} is for measured outcomes; a mean of 0s and 1s with a t statistic misstates the uncertainty for small counts.`
      : `The outcome is measured on a scale, but ${ctx.usedLabel} is for yes/no outcomes; turning measurements into yes/no throws information away.`,
    binaryStudy
      ? `Use ${ctx.design?.family === 'paired' ? 'McNemar on the discordant pairs' : 'the difference of two proportions (Fisher exact for small counts)'}.`
      : 'Analyse the measured values with the procedure recommended for the design.');
}
