/**
 * Choosing the procedure after a pre-test on the same data. Picking the t or a rank test after a
 * normality test, or the pooled or Welch t after an equal-spread test, makes a two-stage procedure
 * whose error rates are neither those of the first nor of the second test (Zimmerman 2004; Rochon,
 * Gondan and Kieser 2012). Welch's t by default, and a rank procedure fixed in advance as the
 * sensitivity analysis, avoid the choice altogether.
 */
import type { AuditContext, Collector } from './context.js';

export function checkPretest(ctx: AuditContext, out: Collector): void {
  const p = ctx.r.pretest;
  if (!p || p === 'none') return;
  const which = p === 'normality' ? 'a normality test' : p === 'equal-spread' ? 'an equal-spread (variance) test' : 'normality and equal-spread tests';
  const fix =
    p === 'equal-spread'
      ? "Use Welch's t for independent groups from the start (it does not need equal spreads); report the pooled t only if it was pre-declared."
      : 'Fix the procedure before seeing the data (the t procedure, with the rank procedure pre-declared as a sensitivity analysis); report both and say which was primary.';
  out.add('pretest-selection',
    `${ctx.usedLabel[0].toUpperCase()}${ctx.usedLabel.slice(1)} was chosen after ${which} on the same data. Such a data-driven choice changes the error rates: the reported p-value no longer has its stated meaning, and a pre-test on a small sample has little power to detect the problem it looks for.`,
    fix);
}
