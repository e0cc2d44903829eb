/**
 * The analysis report: what the diagnostics say against the procedure's conditions (and that
 * the procedure is never switched), the words of the conclusion, the JSON shape, the Markdown,
 * and the terminal plot. Numbers of the procedures are their own tests' business; invented data.
 */
import { describe, expect, it } from 'vitest';
import type { PreparedData } from '../../src/data/types.js';
import { buildAnalysis } from '../../src/report/analysis.js';
import { analysisJson } from '../../src/report/analysis-json.js';
import { analysisMarkdown } from '../../src/report/analysis-markdown.js';
import { analysisText } from '../../src/report/analysis-text.js';
import { agreement, intervalWords, reading } from '../../src/report/analysis-conclusion.js';
import type { AnalysisSpec, DataInfo, ResultBlock } from '../../src/report/analysis-types.js';
import { plotStrips } from '../../src/report/plot.js';
import { makeStyle } from '../../src/report/style.js';

const DATA: DataInfo = { file: 'glaze.csv', layout: 'wide', parser: 'fast', delimiter: 'comma', rows: 10, missingMarkers: ['', 'NA'] };

function spec(over: Partial<AnalysisSpec> = {}): AnalysisSpec {
  return {
    mode: 'quick',
    title: 'Glaze thickness, two gauges',
    procedure: 'paired-t',
    options: { alternative: 'two-sided', confidence: 0.95, nullValue: 0 },
    sensitivity: { id: 'signed-rank', why: 'declared in advance' },
    outcome: { unit: 'um', binary: false },
    conditions: [],
    warnings: [],
    cautions: [],
    ...over,
  };
}

function paired(first: number[], second: number[]): PreparedData {
  return {
    input: { kind: 'paired', first, second },
    layout: 'wide',
    sides: { first: 'gauge A', second: 'gauge B' },
    counts: { rows: first.length, pairs: first.length, dropped: 0 },
    notes: [],
    warnings: [],
  };
}

// Nine small differences and one far out: skewed, an outlier, Shapiro-Wilk rejects.
const SKEWED_SECOND = [10, 11, 12, 10.5, 11.5, 12.5, 10.2, 11.2, 12.2, 10.8];
const SKEWED_FIRST = SKEWED_SECOND.map((x, i) => x + [0.1, 0.2, 0.15, 0.3, 0.1, 0.25, 0.2, 0.12, 0.18, 6][i]);

describe('diagnostics against the conditions', () => {
  it('flags a skewed small sample, keeps the declared procedure, and points to the sensitivity result', () => {
    const a = buildAnalysis(spec(), paired(SKEWED_FIRST, SKEWED_SECOND), DATA);
    expect(a.main.procedure).toBe('paired-t');
    const checks = a.flags.filter((f) => f.severity === 'contradiction').map((f) => f.check);
    expect(checks).toEqual(expect.arrayContaining(['shapiro-wilk', 'skewness', 'outliers']));
    expect(a.flagSummary).toMatch(/The declared procedure is kept, as planned/);
    expect(a.flagSummary).toMatch(/pre-declared sensitivity analysis \(Wilcoxon signed-rank/);
    expect(a.conclusion).toContain(a.flagSummary!);
  });

  it('says that no sensitivity analysis was declared when there is none', () => {
    const a = buildAnalysis(spec({ sensitivity: null }), paired(SKEWED_FIRST, SKEWED_SECOND), DATA);
    expect(a.flagSummary).toMatch(/No sensitivity analysis was declared/);
  });

  it('raises nothing for well-behaved differences', () => {
    const second = [20, 21, 19, 22, 20.5, 21.5, 19.5, 20.2, 21.2, 19.8, 20.7, 21.7];
    const first = second.map((x, i) => x + [0.4, 0.6, 0.5, 0.3, 0.7, 0.5, 0.45, 0.55, 0.6, 0.4, 0.5, 0.52][i]);
    const a = buildAnalysis(spec(), paired(first, second), DATA);
    expect(a.flags.filter((f) => f.severity === 'contradiction')).toEqual([]);
    expect(a.flagSummary).toBeNull();
    expect(a.agreement).toMatch(/agrees/);
  });

  it('flags unequal spreads for the pooled t', () => {
    const prepared: PreparedData = {
      input: { kind: 'independent', first: [10, 10.2, 9.9, 10.1, 10, 9.8], second: [6, 14, 9, 12, 5, 15] },
      layout: 'groups',
      sides: { first: 'kiln 1', second: 'kiln 2' },
      counts: { rows: 12, first: 6, second: 6, dropped: 0 },
      notes: [],
      warnings: [],
    };
    const a = buildAnalysis(spec({ procedure: 'pooled-t', sensitivity: { id: 'welch-t', why: '' } }), prepared, DATA);
    expect(a.flags.some((f) => f.check === 'spread' && f.severity === 'contradiction')).toBe(true);
    expect(a.diagnostics.map((d) => d.label)).toEqual(['kiln 1', 'kiln 2']);
    expect(a.plot.strips).toHaveLength(2);
  });
});

describe('degenerate results', () => {
  it('all differences zero: not computed, with what it means, and no NaN anywhere', () => {
    const x = [3, 4, 5, 6];
    const a = buildAnalysis(spec(), paired(x, [...x]), DATA);
    expect(a.main.available).toBe(false);
    expect(a.main.unavailable).toMatchObject({ code: 'no-variation' });
    expect(a.main.unavailable!.meaning).toMatch(/identical readings on every unit/);
    expect(a.conclusion).toMatch(/could not be computed/);
    const json = analysisJson(a);
    expect(json).not.toMatch(/NaN/);
    expect(JSON.parse(json)).toMatchObject({ available: false, estimate: null, pValue: null });
  });
});

describe('the words of the result', () => {
  const block = (over: Partial<ResultBlock>): ResultBlock => ({
    procedure: 'paired-t', name: 'paired t', method: 'paired t', available: true, n: { pairs: 10, dropped: 0 }, estimate: 1.2, estimateName: 'mean difference',
    ci: [0.4, 2.0], confidence: 0.95, statistic: 3, statisticName: 't', df: 9, pValue: 0.01, alternative: 'two-sided', nullValue: 0, alpha: 0.05,
    effectSize: null, notes: [], details: {}, reading: '', ...over,
  });
  const w = { first: 'glaze A', second: 'glaze B', unit: 'um' };

  it('names the direction and stays within what the test shows', () => {
    expect(reading(block({}), w)).toMatch(/the data indicate that glaze A gives higher values than glaze B on average \(p = 0.01, below 5%\)/);
    expect(reading(block({ estimate: -1.2, ci: [-2, -0.4] }), w)).toMatch(/glaze A gives lower values than glaze B/);
    const ns = reading(block({ pValue: 0.3, ci: [-0.5, 2.9] }), w);
    expect(ns).toMatch(/do not show a difference .* this is not evidence that they are the same/);
    expect(reading(block({ alternative: 'greater', pValue: 0.2, ci: [-0.1, Infinity] }), w)).toMatch(/do not show that glaze A gives higher values .* one-sided/);
    expect(reading(block({ procedure: 'rank-sum' }), w)).toMatch(/stochastic superiority/);
    expect(reading(block({ nullValue: 0.5 }), w)).toMatch(/the difference \(glaze A minus glaze B\) is above 0.5 um/);
  });

  it('with a null value other than zero, a non-significant result is about that value, not about "no difference"', () => {
    const ns = reading(block({ nullValue: 0.5, pValue: 0.3, ci: [-0.2, 1.4] }), w);
    expect(ns).toMatch(/do not show that the difference \(glaze A minus glaze B\) departs from 0.5 um .* not evidence that it equals 0.5/);
    expect(ns).not.toMatch(/a difference between/);
  });

  it('two non-significant results agree whatever the signs of their estimates; two significant ones must point the same way', () => {
    const main = block({ pValue: 0.4, estimate: 0.2, ci: [-0.5, 0.9] });
    const sens = block({ procedure: 'signed-rank', name: 'signed-rank', pValue: 0.3, estimate: -0.1, ci: [-0.6, 0.8] });
    expect(agreement(main, sens, false, w)).toMatch(/agrees/);
    expect(agreement(block({}), block({ procedure: 'signed-rank', name: 'signed-rank', estimate: -1 }), false, w)).toMatch(/does not agree/);
    expect(agreement(block({}), block({ procedure: 'signed-rank', name: 'signed-rank', pValue: 0.2 }), false, w)).toMatch(/does not agree/);
  });

  it('a difference procedure beside an equivalence test is judged by its interval against the margin', () => {
    const eq = block({ procedure: 'paired-equivalence', margin: 3, confidence: 0.9, pValue: 0.01 });
    const inside = block({ procedure: 'signed-rank', name: 'signed-rank', margin: 3, confidence: 0.9, alpha: 0.1, pValue: 0.6, ci: [-1, 2] });
    expect(reading(inside, w)).toMatch(/equivalence shown by the interval: the 90% interval -1 to 2 um lies inside the equivalence range -3 to 3 um/);
    expect(agreement(eq, inside, false, w)).toMatch(/agrees .*its 90% interval -1 to 2 um/);
    const beyond = { ...inside, ci: [-1, 3.5] as [number, number] };
    expect(reading(beyond, w)).toMatch(/equivalence not shown by the interval/);
    expect(agreement(eq, beyond, false, w)).toMatch(/does not agree/);
  });

  it('runs the sensitivity analysis of an equivalence test at the interval level 1 - 2 alpha, two-sided', () => {
    const second = [20, 21, 19, 22, 20.5, 21.5, 19.5, 20.2, 21.2, 19.8, 20.7, 21.7];
    const first = second.map((x, i) => x + [0.4, -0.6, 0.5, -0.3, 0.7, -0.5, 0.45, -0.55, 0.6, -0.4, 0.5, -0.52][i]);
    const a = buildAnalysis(spec({ procedure: 'paired-equivalence', options: { alternative: 'two-sided', confidence: 0.95, nullValue: 0, margin: 2 } }), paired(first, second), DATA);
    expect(a.main.confidence).toBeCloseTo(0.9, 12);
    expect(a.sensitivity!.confidence).toBeCloseTo(0.9, 12);
    expect(a.sensitivity!.margin).toBe(2);
    expect(a.sensitivity!.reading).toMatch(/equivalence shown by the interval/);
    expect(a.agreement).toMatch(/agrees/);
  });

  it('a yes/no outcome with an equivalence margin (plan schema) is judged by its interval, not its p-value', () => {
    // 40 pairs, 2 discordant each way: the difference in proportions is 0 with a narrow interval.
    const first = Array.from({ length: 40 }, (_, i) => (i < 20 || i === 20 || i === 21 ? 1 : 0));
    const second = Array.from({ length: 40 }, (_, i) => (i < 20 || i === 22 || i === 23 ? 1 : 0));
    const a = buildAnalysis(
      spec({ procedure: 'mcnemar', sensitivity: null, outcome: { binary: true }, options: { alternative: 'two-sided', confidence: 0.9, nullValue: 0, margin: 0.3 } }),
      paired(first, second),
      DATA,
    );
    expect(a.main.margin).toBe(0.3);
    expect(a.main.reading).toMatch(/^equivalence shown by the interval: the 90% interval .* lies inside the equivalence range -0.3 to 0.3$/);
  });

  it('reads an equivalence result against its margin', () => {
    const eq = block({ procedure: 'paired-equivalence', margin: 3, confidence: 0.9, pValue: 0.01 });
    expect(reading(eq, w)).toMatch(/equivalence shown at the 5% level .* 90% interval lies inside the equivalence range -3 to 3 um/);
    expect(reading({ ...eq, pValue: 0.2 }, w)).toMatch(/equivalence not shown/);
  });

  it('words one-sided intervals', () => {
    expect(intervalWords([0.4, Infinity], w)).toBe('at least 0.4 um');
    expect(intervalWords([-Infinity, 2], w)).toBe('at most 2 um');
  });
});

describe('renderers', () => {
  const a = buildAnalysis(spec({ cautions: ['Not a substitute for the kiln safety log.'], warnings: ['Gauge B was recalibrated mid-week.'] }), paired(SKEWED_FIRST, SKEWED_SECOND), DATA);

  it('JSON carries the promised fields', () => {
    const doc = JSON.parse(analysisJson(a));
    for (const k of ['procedure', 'n', 'estimate', 'ci', 'confidence', 'statistic', 'df', 'pValue', 'alternative', 'effectSize', 'diagnostics', 'difference', 'conclusion', 'sensitivity']) {
      expect(doc).toHaveProperty(k);
    }
    for (const k of ['procedure', 'n', 'estimate', 'ci', 'confidence', 'statistic', 'pValue', 'alternative', 'effectSize']) expect(doc.sensitivity).toHaveProperty(k);
    expect(doc.cautions).toEqual(['Not a substitute for the kiln safety log.']);
    expect(doc).not.toHaveProperty('plot');
  });

  it('Markdown has our own sections, the plan warnings and cautions, and the plot in a code block', () => {
    const md = analysisMarkdown(a);
    for (const h of ['## What was compared', '## Result: ', '## Sensitivity analysis: ', '## Checks on the data', '## Data handling', '## Warnings from the plan', '## Conclusion', '## Cautions']) expect(md).toContain(h);
    // Every heading is one of the project's own section names.
    const own = ['# ', '## What was compared', '## Result: ', '## Sensitivity analysis: ', '## Checks on the data', '## Data handling', '## Warnings from the plan', '## Conclusion', '## Cautions', '## Plot'];
    for (const h of md.split('\n').filter((l) => l.startsWith('#'))) expect(own.some((o) => h.startsWith(o)), h).toBe(true);
    expect(md).toMatch(/```\n[\s\S]*o[\s\S]*```/);
    expect(md).toContain('**Condition in doubt:**');
  });

  it('text uses colour only through the style', () => {
    expect(analysisText(a, makeStyle(false))).not.toMatch(/\u001b\[/);
    expect(analysisText(a, makeStyle(true))).toMatch(/\u001b\[/);
  });
});

describe('plot', () => {
  it('marks the estimate, its interval and the reference on one scale', () => {
    const p = plotStrips([{ label: 'differences', values: [1, 2, 2, 3, 7], estimate: 3, interval: [0.1, 5.9] }], { width: 30, reference: { value: 0, label: 'none' } });
    const lines = p.split('\n');
    expect(lines[0]).toBe('differences');
    const axis = lines.find((l) => l.startsWith('+'))!;
    expect(axis[1]).toBe('|');
    const marks = lines[lines.length - 1];
    expect(marks).toMatch(/^ +\[=+o=+\]$/);
    expect(lines.filter((l) => l.startsWith('|')).join('')).toContain('#');
  });

  it('draws an open end of a one-sided interval as an arrow', () => {
    const p = plotStrips([{ label: 'd', values: [1, 2, 3], estimate: 2, interval: [1.5, Infinity] }], { width: 20 });
    expect(p.split('\n').pop()).toMatch(/\[=*o=*>$/);
  });

  it('copes with a constant sample and with no finite values', () => {
    expect(plotStrips([{ label: 'flat', values: [4, 4, 4] }])).toContain('flat');
    expect(plotStrips([{ label: 'none', values: [] }])).toMatch(/nothing to plot/);
  });
});
