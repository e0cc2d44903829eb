/**
 * A plan in words: a one-line summary for `tandem plan check`, and a short description for
 * `tandem plan show`. Plain text (no colours); the commands decide where it goes.
 */
import { procedureName } from './procedures.js';
import type { DataMapping, Plan } from './types.js';

function pct(confidence: number): string {
  return `${Number((confidence * 100).toPrecision(6))}%`;
}

/** e.g. "paired design (repeated-measures); paired-t, two-sided, 95% interval; sensitivity: signed-rank; data: wide" */
export function planSummary(plan: Plan): string {
  const p = plan.procedure;
  const margin = p.margin !== undefined ? `, margin ${p.margin}` : '';
  const sens = plan.sensitivity ? plan.sensitivity.id : 'none';
  return `${plan.design.family} design (${plan.design.kind}); ${p.id}, ${p.alternative}, ${pct(p.confidence)} interval${margin}; sensitivity: ${sens}; data: ${plan.data.layout}`;
}

/** Where each value is read from, in words. */
export function describeData(d: DataMapping): string {
  switch (d.layout) {
    case 'wide':
      return `one row per unit; first condition in column '${d.first}', second in '${d.second}'; ${d.pairBy === 'id' ? `each row's unit named in column '${d.id ?? '?'}'` : 'each row is one unit (no id column)'}`;
    case 'long':
      return `one row per measurement; unit in column '${d.id}', condition in '${d.condition}' ('${d.firstLevel}' or '${d.secondLevel}'), value in '${d.value}'`;
    case 'groups':
      return `one row per unit; group in column '${d.group}' ('${d.firstLevel}' or '${d.secondLevel}'), value in '${d.value}'`;
    case 'columns':
      return `one column per group: '${d.first}' and '${d.second}' (lengths may differ)`;
    case 'crossover':
      return `one row per unit; sequence in column '${d.sequence}' ('${d.firstThenSecond}': first condition in period 1, '${d.secondThenFirst}': second condition in period 1), values in '${d.period1}' and '${d.period2}'${d.id ? `, unit in '${d.id}'` : ''}`;
  }
}

/** The plan as a short report in words (for `tandem plan show`). */
export function describePlan(plan: Plan): string {
  const s = plan.study;
  const p = plan.procedure;
  const lines: string[] = [
    plan.title,
    '',
    `Study: ${s.outcome}${s.outcomeUnit ? ` (${s.outcomeUnit})` : ''} on each ${s.unit}, ${s.first} versus ${s.second}${s.event ? `; event value '${s.event}'` : ''}`,
    `Design: ${plan.design.family} (${plan.design.kind})`,
    ...plan.design.reasons.map((r) => `  - ${r}`),
    `Direction: ${plan.difference}`,
    `Procedure: ${procedureName(p.id)} [${p.id}], ${p.alternative}, ${pct(p.confidence)} interval, null value ${p.nullValue}${p.margin !== undefined ? `, equivalence margin ${p.margin}` : ''}`,
    `Sensitivity (declared now): ${plan.sensitivity ? `${procedureName(plan.sensitivity.id)} [${plan.sensitivity.id}]${plan.sensitivity.why ? `: ${plan.sensitivity.why}` : ''}` : 'none'}`,
    `Null hypothesis: ${plan.hypotheses.nullSymbols} (${plan.hypotheses.nullWords})`,
    `Alternative hypothesis: ${plan.hypotheses.alternativeSymbols} (${plan.hypotheses.alternativeWords})`,
    `Data: ${describeData(plan.data)}`,
    `Missing values: ${plan.missingPolicy === 'drop-incomplete-pairs' ? 'a pair with a missing member is dropped whole and counted' : 'missing values are dropped and counted'}`,
    `May claim: ${plan.scope.text}`,
  ];
  if (plan.conditions.length) lines.push('Conditions to check:', ...plan.conditions.map((c) => `  - ${c.text} (check: ${c.check})${c.basis ? ` [${c.basis}]` : ''}`));
  if (plan.warnings.length) lines.push('Warnings:', ...plan.warnings.map((w) => `  - ${w}`));
  if (plan.cautions.length) lines.push('Cautions:', ...plan.cautions.map((c) => `  - ${c}`));
  return lines.join('\n') + '\n';
}
