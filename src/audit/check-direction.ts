/**
 * The direction of subtraction and the sidedness. A one-sided alternative means something only
 * with a stated subtraction: "greater" for first minus second says the first condition was
 * expected higher. With "greater", a negative statistic gives a one-sided p above 0.5; a small p
 * then belongs to the opposite alternative, or the subtraction was reversed somewhere.
 *
 * The study's expected direction (from the interview) fixes the alternative before the data are
 * seen; a one-sided test the study did not plan, or one pointing the other way, is flagged.
 */
import type { Alternative } from '../stats/types.js';
import type { AuditContext, Collector } from './context.js';
import { pRangeReported } from './check-pvalue.js';
import { rangeOf } from './digits.js';
import { estimateRange } from './check-interval.js';

export function checkDirection(ctx: AuditContext, out: Collector): void {
  const { r } = ctx;
  const alt = r.alternative;
  const oneSided = alt === 'greater' || alt === 'less';
  if (oneSided && !r.difference) {
    out.add('one-sided-no-direction',
      `The test is one-sided ("${alt}") but the report does not say which condition was subtracted from which, so "${alt}" cannot be read: it could mean either condition was expected higher.`,
      'State the subtraction ("each difference is <first> minus <second>") and which condition was expected higher, decided before seeing the data.');
  } else if (!r.difference && (r.estimate || r.statistic || r.ci)) {
    out.add('direction-unstated',
      'The report does not say which condition was subtracted from which, so a reader cannot tell what a positive estimate means.',
      'State the subtraction in words: "each difference is <first> minus <second>; a positive difference means <first> was higher".');
  }
  if (oneSided && r.difference) checkSignAgainstAlternative(ctx, out, alt);
  checkClaim(ctx, out);
  checkAgainstStudy(ctx, out);
}

function checkSignAgainstAlternative(ctx: AuditContext, out: Collector, alt: Alternative): void {
  const { statistic, pValue } = ctx.r;
  const est = estimateRange(ctx);
  const sign = statistic ? signOf(rangeOf(statistic)) : est ? signOf(est) : 0;
  if (sign === 0) return;
  const against = (alt === 'greater' && sign < 0) || (alt === 'less' && sign > 0);
  if (!against) return;
  const small = pValue ? pRangeReported(pValue)[1] < 0.5 : false;
  const what = statistic ? `statistic ${statistic.text}` : `estimate ${ctx.r.estimate?.text ?? ''}`.trim();
  const expect = alt === 'greater' ? `${ctx.r.difference!.first} higher` : `${ctx.r.difference!.second} higher`;
  out.add('sign-vs-direction',
    small
      ? `The alternative says ${expect} (${ctx.subtraction} ${alt === 'greater' ? '> 0' : '< 0'}), but the ${what} points the other way; the one-sided p-value for the stated alternative is then above 0.5, yet the report gives p = ${pValue!.text}. Either the subtraction was reversed, or the p-value belongs to the opposite alternative.`
      : `The alternative says ${expect} (${ctx.subtraction} ${alt === 'greater' ? '> 0' : '< 0'}), but the ${what} points the other way: the data lean against the stated alternative.`,
    small
      ? `Report the p-value of the alternative that was fixed before the data were seen (for "${alt}" with ${ctx.subtraction} it is above 0.5 here), and check that the subtraction in the software matches the one stated; never switch the alternative after seeing the data.`
      : 'Report the result as it is: no support for the stated direction. Do not switch the alternative after seeing the data.');
}

function checkClaim(ctx: AuditContext, out: Collector): void {
  const { claim, difference } = ctx.r;
  const est = estimateRange(ctx);
  if (!difference || !est || (claim !== 'first-higher' && claim !== 'second-higher')) return;
  const s = signOf(est);
  const claimed = claim === 'first-higher' ? difference.first : difference.second;
  if ((claim === 'first-higher' && s < 0) || (claim === 'second-higher' && s > 0)) {
    out.add('sign-vs-direction',
      `The report concludes that ${claimed} was higher, but the estimate for ${ctx.subtraction} is ${s < 0 ? 'negative' : 'positive'}, which says the opposite.`,
      `Read the sign with the stated subtraction: a positive ${ctx.subtraction} means ${difference.first} was higher.`);
  }
}

/** The alternative against the direction the study expected (interview answers). */
function checkAgainstStudy(ctx: AuditContext, out: Collector): void {
  const planned = ctx.rec?.procedure.alternative;
  const alt = ctx.r.alternative;
  if (!planned || !alt || alt === 'two-sided' || ctx.rec?.procedure.margin !== undefined) return;
  if (planned === 'two-sided') {
    out.add('one-sided-not-planned',
      `The study facts expected a difference in either direction, but the test is one-sided ("${alt}"). A one-sided test chosen without a direction fixed in advance halves the p-value on the side the data happened to fall.`,
      'Report the two-sided p-value, unless the one-sided direction was written down before the data were seen (then cite where).');
    return;
  }
  const a = ctx.record.answers ?? {};
  const studyFirst = typeof a.first_label === 'string' ? a.first_label.trim().toLowerCase() : undefined;
  const studySecond = typeof a.second_label === 'string' ? a.second_label.trim().toLowerCase() : undefined;
  const d = ctx.r.difference;
  let expected: Alternative | undefined;
  if (!d || !studyFirst || !studySecond) expected = d ? undefined : planned;
  else if (d.first.trim().toLowerCase() === studyFirst && d.second.trim().toLowerCase() === studySecond) expected = planned;
  else if (d.first.trim().toLowerCase() === studySecond && d.second.trim().toLowerCase() === studyFirst) expected = planned === 'greater' ? 'less' : 'greater';
  if (expected && expected !== alt) {
    out.add('alternative-vs-plan',
      `The study expected ${planned === 'greater' ? a.first_label ?? 'the first condition' : a.second_label ?? 'the second condition'} to be higher, but the one-sided alternative "${alt}"${d ? ` for ${ctx.subtraction}` : ''} tests the opposite direction.`,
      `Use the alternative "${expected}"${d ? ` for ${ctx.subtraction}` : ''}, as the study planned, and report its p-value.`);
  }
}

function signOf(r: [number, number]): number {
  return r[0] > 0 ? 1 : r[1] < 0 ? -1 : 0;
}
