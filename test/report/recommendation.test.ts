import { describe, expect, it } from 'vitest';
import { escapeMarkdown, headline, renderRecommendationMarkdown, renderRecommendationText, shellQuote } from '../../src/report/recommendation.js';
import { makeStyle } from '../../src/report/style.js';
import { coldBoxes, hiveFeeds, scriptCrossover, splitLoaves, vineDates, weldInspection } from '../plan/recommendations.js';

const plain = makeStyle(false);
const headings = (text: string): string[] => text.split('\n').filter((l) => /^[A-Z][A-Z ()]+$/.test(l));
const stripAnsi = (s: string): string => s.replace(/\u001b\[[0-9;]*m/g, '');

describe('recommendation as terminal text', () => {
  it('has our own sections, in reading order', () => {
    const text = renderRecommendationText(splitLoaves(), plain, { planPath: 'loaves.plan.yaml' });
    expect(headings(text)).toEqual([
      'DESIGN',
      'WHY',
      'PROCEDURE',
      'SENSITIVITY ANALYSIS (DECLARED NOW)',
      'HOW N AND DF ARE COUNTED',
      'DIRECTION OF SUBTRACTION',
      'HYPOTHESES',
      'CONDITIONS TO CHECK',
      'WHAT THE CONCLUSION MAY CLAIM',
      'NEXT STEPS',
    ]);
    expect(text).not.toMatch(/\b(STATE|CONCLUDE)\b/);
  });

  it('states the design, the procedure, n and df, the direction and the hypotheses in words', () => {
    const text = renderRecommendationText(splitLoaves(), plain);
    expect(text.split('\n')[0]).toBe('Recommendation: Oven A versus Oven B, crust moisture (%) on each dough piece');
    expect(text).toContain('Paired: split units (each dough piece halved) [split-units]');
    expect(text).toContain('paired t on the differences [paired-t]');
    expect(text).toContain('Wilcoxon signed-rank on the differences [signed-rank]');
    expect(text).toMatch(/Fixed now and reported beside the main result/);
    expect(text).toContain('n = number of complete pairs (dough pieces)\n  df = pairs - 1');
    expect(text).toContain('each difference is Oven A minus Oven B; a positive difference means Oven A was higher');
    expect(text).toContain('  Null:        mu_d = 0\n               on average Oven A and Oven B give the same crust moisture');
    expect(text).toContain('  Alternative: mu_d != 0\n               on average the two ovens give different crust moisture');
    expect(text).toMatch(/\[common\s+practice, no source\]/);
  });

  it('shows when the procedure applies, its confidence level, notes and sources when the recommendation has them', () => {
    const rec = weldInspection();
    rec.procedure.margin = 0.05;
    rec.procedure.confidence = 0.9;
    rec.procedure.applies = 'Paired yes/no outcomes.';
    rec.procedure.notes = ['Equivalence is judged by the 90% interval lying inside -0.05 to +0.05.'];
    rec.procedure.references = ['McNemar (1947)'];
    const text = renderRecommendationText(rec, plain);
    expect(text).toContain('  When it applies: Paired yes/no outcomes.');
    expect(text).toContain('  Aim: equivalence, the difference of proportions lies between -0.05 and +0.05\n');
    expect(text).toContain('  Confidence level of the interval: 90%');
    expect(text).toContain('  - Equivalence is judged by the 90% interval');
    expect(text).toContain('  Sources: McNemar (1947)');
    expect(renderRecommendationText(splitLoaves(), plain)).toContain('  Confidence level of the interval: 95%');
  });

  it('says what the conclusion may claim from the scope', () => {
    const causal = renderRecommendationText(splitLoaves(), plain);
    expect(causal).toMatch(/Cause and effect: yes/);
    expect(causal).toMatch(/Beyond the units studied: no/);
    const rec = hiveFeeds();
    rec.scope = { causal: false, generalize: true, text: '' };
    const t = renderRecommendationText(rec, plain);
    expect(t).toMatch(/Cause and effect: no, .*association/);
    expect(t).toMatch(/Beyond the units studied: yes/);
  });

  it('words a one-sided alternative with the first label, and an equivalence aim with the margin and unit', () => {
    expect(renderRecommendationText(hiveFeeds(), plain)).toContain('Alternative: one-sided, Pollen patty higher');
    expect(renderRecommendationText(coldBoxes(), plain)).toContain('Aim: equivalence, the mean difference lies between -0.5 and +0.5 °C');
  });

  it('shows warnings and cautions when there are any', () => {
    expect(headings(renderRecommendationText(weldInspection(), plain))).toContain('WARNINGS');
    const t = renderRecommendationText(coldBoxes(), plain);
    expect(headings(t)).toContain('CAUTIONS');
    expect(t).toMatch(/qualified statistician/);
    expect(renderRecommendationText(weldInspection(), plain)).toContain('SENSITIVITY ANALYSIS (DECLARED NOW)\n  None for this procedure.');
  });

  it('leads with what to do instead for a design outside a two-condition comparison', () => {
    const text = renderRecommendationText(vineDates(), plain);
    expect(headings(text)).toEqual(['WHAT TO DO INSTEAD', 'DESIGN', 'WHY', 'WARNINGS', 'NEXT STEPS']);
    expect(text).toMatch(/WHAT TO DO INSTEAD\n {2}This is not a comparison of two conditions that tandem can analyse: more than two time\n {2}points\.\n {2}Analyse all four dates together/);
    expect(text).toMatch(/tandem writes no plan for this design/);
  });

  it('gives the exact next commands for the plan', () => {
    const paired = renderRecommendationText(splitLoaves(), plain, { planPath: 'loaves.plan.yaml' });
    expect(paired).toContain('    tandem plan check loaves.plan.yaml');
    expect(paired).toContain('    tandem size loaves.plan.yaml --difference D --sd-diff S');
    expect(paired).toContain('    tandem analyze loaves.plan.yaml --data YOUR_DATA.csv');
    const groups = renderRecommendationText(hiveFeeds(), plain, { planPath: 'spring feeds/hives.yaml' });
    expect(groups).toContain("    tandem size 'spring feeds/hives.yaml' --difference D --sd S");
    expect(renderRecommendationText(weldInspection(), plain, { planPath: 'w.yaml' })).not.toMatch(/tandem size/);
    expect(renderRecommendationText(scriptCrossover(), plain, { planPath: 'c.yaml' })).not.toMatch(/tandem size/);
    const unwritten = renderRecommendationText(hiveFeeds(), plain, { answersPath: 'hives.answers.yaml' });
    expect(unwritten).toContain('    tandem advise --answers hives.answers.yaml --plan plan.yaml');
    expect(renderRecommendationText(hiveFeeds(), plain)).toContain('    tandem advise --save-answers answers.yaml --plan plan.yaml');
  });

  it('wraps prose to the width and keeps commands whole', () => {
    const text = renderRecommendationText(splitLoaves(), plain, { planPath: 'a-very-long-folder-name/with-a-long-plan-file-name-for-the-deck-oven-trial.plan.yaml' });
    for (const line of text.split('\n')) if (!line.startsWith('    tandem')) expect(line.length).toBeLessThanOrEqual(92);
  });

  it('colours only through the style: without colour no escape codes, with colour the same words', () => {
    const off = renderRecommendationText(coldBoxes(), makeStyle(false));
    const on = renderRecommendationText(coldBoxes(), makeStyle(true));
    expect(off).not.toMatch(/\u001b\[/);
    expect(on).toMatch(/\u001b\[/);
    expect(stripAnsi(on)).toBe(off);
  });

  it('builds the headline from whatever labels the answers hold', () => {
    const rec = splitLoaves();
    rec.answers = { outcome: 'crust moisture' };
    expect(headline(rec)).toBe('Recommendation: crust moisture');
    rec.answers = {};
    expect(headline(rec)).toBe('Recommendation');
  });
});

describe('recommendation as Markdown', () => {
  it('uses the same sections as headings, the hypotheses in code spans and the commands in a shell block', () => {
    const md = renderRecommendationMarkdown(splitLoaves(), { planPath: 'loaves.plan.yaml' });
    expect(md.split('\n')[0]).toBe('# Recommendation: Oven A versus Oven B, crust moisture (%) on each dough piece');
    expect(md.match(/^## .*/gm)).toEqual([
      '## Design',
      '## Why',
      '## Procedure',
      '## Sensitivity analysis (declared now)',
      '## How n and df are counted',
      '## Direction of subtraction',
      '## Hypotheses',
      '## Conditions to check',
      '## What the conclusion may claim',
      '## Next steps',
    ]);
    expect(md).toContain('- Null: `mu_d = 0`  \n  on average Oven A and Oven B give the same crust moisture');
    expect(md).toContain('```sh\ntandem analyze loaves.plan.yaml --data YOUR_DATA.csv\n```');
  });

  it('escapes Markdown characters in labels so they stay literal', () => {
    const rec = splitLoaves();
    rec.answers.first_label = 'Oven *A*';
    rec.answers.second_label = 'oven_b';
    expect(renderRecommendationMarkdown(rec).split('\n')[0]).toBe('# Recommendation: Oven \\*A\\* versus oven\\_b, crust moisture (%) on each dough piece');
    expect(escapeMarkdown('a|b <c> [d] `e` #f')).toBe('a\\|b \\<c\\> \\[d\\] \\`e\\` \\#f');
  });

  it('puts what to do instead first, as a quoted, bold block', () => {
    const md = renderRecommendationMarkdown(vineDates());
    expect(md).toMatch(/^# Recommendation: June versus July, grape sugar \(°Brix\) on each vine\n\n## What to do instead\n\n> \*\*This is not a comparison/);
    expect(md).not.toMatch(/## Procedure/);
  });
});

describe('shellQuote', () => {
  it('leaves plain paths alone and single-quotes the rest', () => {
    expect(shellQuote('plans/hives-2025.plan.yaml')).toBe('plans/hives-2025.plan.yaml');
    expect(shellQuote("Mia's hives.yaml")).toBe("'Mia'\\''s hives.yaml'");
  });
});
