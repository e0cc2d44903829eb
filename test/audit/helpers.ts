/** Shared helpers for the audit tests: a record from YAML text, and the audit of it. */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { loadYaml } from '../../src/yaml/load.js';
import { parseRecord, type ParsedRecord } from '../../src/audit/record.js';
import { auditRecord } from '../../src/audit/index.js';
import type { AuditResult } from '../../src/audit/types.js';
import type { Recommendation } from '../../src/engine/types.js';

export const schema = JSON.parse(readFileSync(fileURLToPath(new URL('../../schemas/audit-v1.schema.json', import.meta.url)), 'utf8')) as object;

export function parse(yamlText: string, file = 'record.yaml'): ParsedRecord {
  return parseRecord(loadYaml(yamlText, file), schema);
}

/** Audits a record given as YAML; throws if the record itself has problems. */
export function audit(yamlText: string, rec: Recommendation | null = null): AuditResult {
  const p = parse(yamlText);
  if (p.problems.length) throw new Error(p.problems.map((x) => `${x.line}:${x.col} ${x.message}`).join('\n'));
  return auditRecord(p.record, rec);
}

export function codes(r: AuditResult): string[] {
  return r.findings.map((f) => f.code);
}

/** A reported record with `format` and `title` filled in; `reported` is YAML lines (indented 2). */
export function rec(reported: string, extra = ''): string {
  return `format: tandem-audit/1\ntitle: test\n${extra}reported:\n${reported.replace(/^/gm, '  ')}\n`;
}

/** A minimal Recommendation for a design family/kind and procedure, as the engine would return. */
export function recommendation(family: 'paired' | 'independent' | 'other', kind: string, id: Recommendation['procedure']['id'], extra: Partial<Recommendation['procedure']> = {}): Recommendation {
  return {
    design: { family, kind, label: kind.replace(/-/g, ' '), reasons: [] },
    procedure: { id, name: String(id), fallback: null, nCounting: '', df: '', estimate: '', alternative: 'two-sided', ...extra },
    conditions: [],
    difference: '',
    hypotheses: { nullSymbols: '', alternativeSymbols: '', nullWords: '', alternativeWords: '' },
    scope: { causal: false, generalize: false, text: '' },
    warnings: [],
    cautions: [],
    trace: [],
    answers: {},
  };
}

export interface Reference {
  library: { scipy: string; numpy: string };
  pvalues: { dist: 't' | 'normal' | 'chisq1'; stat: number; df: number | null; alternative: 'two-sided' | 'greater' | 'less'; p: number }[];
  quantiles: { p: number; df: number; q: number }[];
  welch: { s1: number; s2: number; n1: number; n2: number; df: number }[];
  hedges: { df: number; J: number }[];
  tost: { estimate: number; se: number; df: number; margin: number; pLower: number; pUpper: number }[];
  analyses: Record<string, any>[];
}

export const reference = JSON.parse(readFileSync(fileURLToPath(new URL('../fixtures/scipy-audit/reference.json', import.meta.url)), 'utf8')) as Reference;
