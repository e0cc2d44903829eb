/**
 * Turning schema-checked raw items into engine definitions, section by section. The schema has
 * already checked keys and types; here come the checks a schema cannot make (unique ids, choices
 * only on choice questions, known designs and procedures).
 */
import type { Problem } from '../problems.js';
import type { LoadedYaml } from '../yaml/load.js';
import { PROCEDURE_IDS, type Alternative, type ProcedureId } from '../stats/types.js';
import type {
  ClassRule, Condition, ConditionDef, DerivedDef, DesignDef, DifferenceDef, HypothesesDef, NoteDef, Pos,
  PredicateDef, ProcedureDef, QuestionDef, ScopeDef, SelectionDef,
} from '../engine/model.js';
import type { DesignFamily } from '../engine/types.js';

export type Raw = Record<string, unknown>;
export interface Item {
  raw: Raw;
  loaded: LoadedYaml;
  path: (string | number)[];
  pos: Pos;
}
type When = (it: Item) => Condition | undefined;

interface Helpers {
  problem: (code: Problem['code'], it: Item, sub: (string | number)[], message: string, hint?: string, key?: boolean) => void;
  unique: (namespace: string, id: string, it: Item, key?: string) => boolean;
  problems: Problem[];
}

const str = (v: unknown): string => (typeof v === 'string' ? v : '');
const optStr = (v: unknown): string | undefined => (typeof v === 'string' ? v : undefined);
const isProc = (v: unknown): v is ProcedureId => typeof v === 'string' && (PROCEDURE_IDS as readonly string[]).includes(v);

export function buildItems(h: Helpers) {
  const { problem, unique } = h;
  return {
    questions(list: Item[]): QuestionDef[] {
      const out: QuestionDef[] = [];
      for (const it of list) {
        const r = it.raw;
        const id = str(r.id);
        if (!unique('question', id, it)) continue;
        const type = r.type as QuestionDef['type'];
        const choices = Array.isArray(r.choices) ? (r.choices as Raw[]).map((c) => ({ value: str(c.value), label: str(c.label), help: str(c.help) })) : undefined;
        if (type === 'choice' && !choices) problem('missing-key', it, ['type'], `choice question '${id}' has no choices`);
        if (type !== 'choice' && choices) problem('unknown-key', it, ['choices'], `question '${id}' is a ${type} question; only choice questions have choices`, undefined, true);
        for (const k of ['min', 'max', 'integer', 'min_exclusive']) {
          if (r[k] !== undefined && type !== 'number') problem('unknown-key', it, [k], `'${k}' applies only to number questions ('${id}' is a ${type} question)`, undefined, true);
        }
        const values = new Set<string>();
        choices?.forEach((c, i) => {
          if (values.has(c.value)) problem('duplicate-id', it, ['choices', i, 'value'], `question '${id}' lists the choice '${c.value}' twice`);
          values.add(c.value);
        });
        if (typeof r.min === 'number' && typeof r.max === 'number' && r.min > r.max) problem('schema', it, ['max'], `question '${id}': max ${r.max} is below min ${r.min}`);
        out.push({
          id,
          text: str(r.text),
          help: str(r.help),
          type,
          ...(choices ? { choices } : {}),
          ...(typeof r.min === 'number' ? { min: r.min } : {}),
          ...(typeof r.max === 'number' ? { max: r.max } : {}),
          ...(r.min_exclusive === true ? { minExclusive: true } : {}),
          ...(r.integer === true ? { integer: true } : {}),
          ...(r.optional === true ? { optional: true } : {}),
          pos: it.pos,
        });
      }
      return out;
    },

    derived(list: Item[], questions: QuestionDef[]): DerivedDef[] {
      const numeric = new Set(questions.filter((q) => q.type === 'number').map((q) => q.id));
      const taken = new Set(questions.map((q) => q.id));
      const out: DerivedDef[] = [];
      for (const it of list) {
        const id = str(it.raw.id);
        if (taken.has(id)) {
          problem('duplicate-id', it, ['id'], `derived fact '${id}' has the id of a question`);
          continue;
        }
        if (!unique('derived', id, it)) continue;
        const op = (['max', 'min', 'ratio'] as const).find((k) => Array.isArray(it.raw[k]));
        if (!op) {
          problem('unknown-operator', it, [], `derived fact '${id}' needs one of max, min, ratio`);
          continue;
        }
        const args = (it.raw[op] as string[]).map(String);
        let ok = true;
        args.forEach((a, i) => {
          if (!numeric.has(a)) {
            ok = false;
            problem('dangling-ref', it, [op, i], `derived fact '${id}' reads '${a}', which is not a number question or an earlier derived fact`);
          }
        });
        if (ok) {
          numeric.add(id);
          out.push({ id, op, args, description: str(it.raw.description), pos: it.pos });
        }
      }
      return out;
    },

    designs(list: Item[]): Map<string, DesignDef> {
      const out = new Map<string, DesignDef>();
      for (const it of list) {
        const kind = str(it.raw.kind);
        if (!unique('design', kind, it, 'kind')) continue;
        const family = it.raw.family as DesignFamily;
        if (family === 'other' && !it.raw.instead) problem('missing-key', it, ['kind'], `design '${kind}' is outside a two-condition comparison and needs 'instead' (what to do instead)`);
        out.set(kind, { kind, family, label: str(it.raw.label), description: str(it.raw.description), instead: optStr(it.raw.instead), pos: it.pos });
      }
      return out;
    },

    predicates(list: Item[], when: When): Map<string, PredicateDef> {
      const out = new Map<string, PredicateDef>();
      const ok = list.filter((it) => unique('predicate', str(it.raw.id), it));
      for (const it of ok) {
        const w = when(it);
        if (w) out.set(str(it.raw.id), { id: str(it.raw.id), description: str(it.raw.description), when: w, pos: it.pos });
      }
      return out;
    },

    rules(list: Item[], designs: Map<string, DesignDef>, when: When): ClassRule[] {
      const out: ClassRule[] = [];
      for (const it of list) {
        const id = str(it.raw.id);
        if (!unique('rule', id, it)) continue;
        const design = str(it.raw.design);
        if (!designs.has(design)) problem('dangling-ref', it, ['design'], `rule '${id}' names unknown design '${design}'`, `known: ${[...designs.keys()].join(', ')}`);
        const w = when(it);
        if (w && designs.has(design)) out.push({ id, when: w, design, reasons: (it.raw.reasons as string[]).map(String), instead: optStr(it.raw.instead), pos: it.pos });
      }
      return out;
    },

    procedures(list: Item[]): Map<ProcedureId, ProcedureDef> {
      const out = new Map<ProcedureId, ProcedureDef>();
      for (const it of list) {
        const r = it.raw;
        if (!isProc(r.id)) {
          problem('unknown-value', it, ['id'], `unknown procedure id '${str(r.id)}'`, `allowed: ${PROCEDURE_IDS.join(', ')}`);
          continue;
        }
        if (!unique('procedure', r.id, it)) continue;
        const param = r.parameter as Raw;
        out.set(r.id, {
          id: r.id, name: str(r.name), applies: str(r.applies), nCounting: str(r.n_counting), df: str(r.df), estimate: str(r.estimate),
          param: { symbol: str(param.symbol), words: str(param.words) },
          conditions: (r.conditions as string[]).map(String), references: (r.references as string[]).map(String), pos: it.pos,
        });
      }
      return out;
    },

    selections(list: Item[], procedures: Map<ProcedureId, ProcedureDef>, when: When): SelectionDef[] {
      const out: SelectionDef[] = [];
      for (const it of list) {
        const r = it.raw;
        const id = str(r.id);
        if (!unique('rule', id, it)) continue;
        let ok = true;
        for (const k of ['procedure', 'fallback'] as const) {
          const v = r[k];
          if (v !== null && !(isProc(v) && procedures.has(v))) {
            ok = false;
            problem(isProc(v) ? 'dangling-ref' : 'unknown-value', it, [k], `selection '${id}': '${String(v)}' is not a procedure in the catalogue`, `catalogue: ${[...procedures.keys()].join(', ')}, or null`);
          }
        }
        if (r.procedure === null && !r.name) problem('missing-key', it, ['procedure'], `selection '${id}' chooses no procedure and needs 'name' (what is shown instead)`);
        const w = when(it);
        if (!w || !ok) continue;
        out.push({
          id, when: w, procedure: r.procedure as ProcedureId | null, name: optStr(r.name), fallback: r.fallback as ProcedureId | null,
          fallbackWhy: optStr(r.fallback_why), confidence: typeof r.confidence === 'number' ? r.confidence : undefined,
          notes: Array.isArray(r.notes) ? (r.notes as string[]).map(String) : [], pos: it.pos,
        });
      }
      return out;
    },

    conditionsToCheck(list: Item[], when: When): Map<string, ConditionDef> {
      const out = new Map<string, ConditionDef>();
      for (const it of list) {
        const id = str(it.raw.id);
        if (!unique('condition', id, it)) continue;
        const w = it.raw.when === undefined ? undefined : when(it);
        if (it.raw.when !== undefined && !w) continue;
        out.set(id, { id, when: w, text: str(it.raw.text), check: str(it.raw.check), basis: optStr(it.raw.basis), pos: it.pos });
      }
      return out;
    },

    differences(list: Item[], when: When): DifferenceDef[] {
      return statements(list, when, (r) => ({ text: str(r.text) }));
    },
    hypotheses(list: Item[], when: When): HypothesesDef[] {
      return statements(list, when, (r) => ({
        alternative: r.alternative as Alternative, nullSymbols: str(r.null_symbols), alternativeSymbols: str(r.alternative_symbols),
        nullWords: str(r.null_words), alternativeWords: str(r.alternative_words),
      }));
    },
    scope(list: Item[], when: When): ScopeDef[] {
      return statements(list, when, (r) => ({ causal: r.causal === true, generalize: r.generalize === true, text: str(r.text) }));
    },
    notes(list: Item[], _what: string, when: When): NoteDef[] {
      return statements(list, when, (r) => ({ text: str(r.text) }));
    },
  };

  function statements<T>(list: Item[], when: When, rest: (r: Raw) => T): ({ id: string; when?: Condition; pos: Pos } & T)[] {
    const out: ({ id: string; when?: Condition; pos: Pos } & T)[] = [];
    for (const it of list) {
      const id = str(it.raw.id);
      if (!unique('rule', id, it)) continue;
      const w = it.raw.when === undefined ? undefined : when(it);
      if (it.raw.when !== undefined && !w) continue;
      out.push({ id, ...(w ? { when: w } : {}), pos: it.pos, ...rest(it.raw) });
    }
    return out;
  }
}
