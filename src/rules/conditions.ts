/**
 * Reading a condition from a rule file into the engine's form, checking it on the way: only the
 * closed vocabulary of operators (all, any, not, ref, and the leaf operators equals, in,
 * answered, gt, gte, lt, lte), only known facts and predicates, values of the right type, and a
 * choice question compared only with one of its choice values. Every problem carries the file,
 * line and column of the offending key or value.
 */
import type { Problem } from '../problems.js';
import { positionOf, type LoadedYaml } from '../yaml/load.js';
import { GROUP_OPERATORS, LEAF_OPERATORS, type Condition, type LeafOperator, type Pos, type QuestionDef } from '../engine/model.js';

export interface FactInfo {
  /** 0: answers and derived facts; 1: design facts; 2: procedure facts. */
  stage: 0 | 1 | 2;
  numeric: boolean;
  question?: QuestionDef;
  /** Allowed values for stage facts with a closed set (design_family...). */
  values?: readonly string[];
}

export interface ParseContext {
  loaded: LoadedYaml;
  facts: Map<string, FactInfo>;
  predicates: Set<string>;
  problems: Problem[];
  /** The latest stage whose facts this condition may read. */
  maxStage: 0 | 1 | 2;
  /** What is being read, for messages ("the guard of question 'pairing'"). */
  where: string;
}

type Path = (string | number)[];

const isObj = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x);
const OPS = [...GROUP_OPERATORS, ...LEAF_OPERATORS].join(', ');

export function posAt(loaded: LoadedYaml, path: Path, key = false): Pos {
  const p = positionOf(loaded, path, { key });
  return { file: loaded.file, line: p.line, col: p.col };
}

function add(ctx: ParseContext, code: Problem['code'], path: Path, message: string, hint?: string, key = false): void {
  const p = posAt(ctx.loaded, path, key);
  ctx.problems.push({ code, file: p.file, line: p.line, col: p.col, message: `${ctx.where}: ${message}`, hint });
}

export function parseCondition(raw: unknown, path: Path, ctx: ParseContext): Condition | undefined {
  const pos = posAt(ctx.loaded, path);
  if (!isObj(raw)) {
    add(ctx, 'wrong-type', path, 'a condition must be a mapping', `use one of: ${OPS}`);
    return undefined;
  }
  const keys = Object.keys(raw);
  if ('fact' in raw) return parseLeaf(raw, path, ctx, pos);
  if (keys.length !== 1) {
    add(ctx, keys.length === 0 ? 'missing-key' : 'unknown-operator', path, `a condition needs exactly one operator, found ${keys.length ? keys.join(', ') : 'none'}`, `use one of: ${OPS}; a leaf is {fact: ID, <operator>: VALUE}`);
    return undefined;
  }
  const op = keys[0];
  const arg = raw[op];
  if (op === 'all' || op === 'any') {
    if (!Array.isArray(arg) || arg.length === 0) {
      add(ctx, 'wrong-type', [...path, op], `'${op}' takes a non-empty list of conditions`);
      return undefined;
    }
    const items = arg.map((x, i) => parseCondition(x, [...path, op, i], ctx));
    return items.every((x): x is Condition => x !== undefined) ? { op, items, pos } : undefined;
  }
  if (op === 'not') {
    const item = parseCondition(arg, [...path, op], ctx);
    return item ? { op, item, pos } : undefined;
  }
  if (op === 'ref') {
    if (typeof arg !== 'string') {
      add(ctx, 'wrong-type', [...path, op], "'ref' takes the id of a predicate");
      return undefined;
    }
    if (!ctx.predicates.has(arg)) {
      add(ctx, 'dangling-ref', [...path, op], `unknown predicate '${arg}'`, ctx.predicates.size ? `known: ${[...ctx.predicates].join(', ')}` : 'no predicates are defined');
      return undefined;
    }
    return { op, name: arg, pos };
  }
  if ((LEAF_OPERATORS as readonly string[]).includes(op)) {
    add(ctx, 'missing-key', path, `'${op}' needs a fact to compare`, `write {fact: ID, ${op}: VALUE}`);
    return undefined;
  }
  add(ctx, 'unknown-operator', [...path, op], `unknown operator '${op}'`, `use one of: ${OPS}`, true);
  return undefined;
}

function parseLeaf(raw: Record<string, unknown>, path: Path, ctx: ParseContext, pos: Pos): Condition | undefined {
  const fact = raw.fact;
  const ops = Object.keys(raw).filter((k) => k !== 'fact');
  if (ops.length !== 1) {
    add(ctx, ops.length === 0 ? 'missing-key' : 'unknown-operator', path, `a leaf needs exactly one operator besides 'fact', found ${ops.length ? ops.join(', ') : 'none'}`, `operators: ${LEAF_OPERATORS.join(', ')}`);
    return undefined;
  }
  const op = ops[0];
  if (!(LEAF_OPERATORS as readonly string[]).includes(op)) {
    add(ctx, 'unknown-operator', [...path, op], `unknown operator '${op}'`, `operators for a fact: ${LEAF_OPERATORS.join(', ')}`, true);
    return undefined;
  }
  if (typeof fact !== 'string') {
    add(ctx, 'wrong-type', [...path, 'fact'], "'fact' must be the id of a question or derived fact");
    return undefined;
  }
  const info = ctx.facts.get(fact);
  if (!info) {
    add(ctx, 'dangling-ref', [...path, 'fact'], `unknown fact '${fact}'`, 'a fact is a question id, a derived fact id, or design_family, design_kind, procedure, fallback');
    return undefined;
  }
  if (info.stage > ctx.maxStage) {
    add(ctx, 'dangling-ref', [...path, 'fact'], `fact '${fact}' is not known yet at this point`, ctx.maxStage === 0 ? 'questions and classification rules may read only answers and derived facts' : 'procedure selections may read answers and the design, not the procedure');
    return undefined;
  }
  const value = raw[op];
  const valuePath = [...path, op];
  const leaf = { op: op as LeafOperator, fact, value, pos };
  const bad = (msg: string, hint?: string): undefined => (add(ctx, 'wrong-type', valuePath, msg, hint), undefined);
  switch (op as LeafOperator) {
    case 'answered':
      return typeof value === 'boolean' ? leaf : bad("'answered' takes true or false");
    case 'gt':
    case 'gte':
    case 'lt':
    case 'lte':
      if (typeof value !== 'number' || !Number.isFinite(value)) return bad(`'${op}' takes a number`);
      if (!info.numeric) return bad(`'${op}' compares numbers, but '${fact}' is not a number question or derived number`);
      return leaf;
    case 'equals':
      if (typeof value !== 'string' && typeof value !== 'number' && typeof value !== 'boolean') return bad("'equals' takes a single value");
      return checkValues(ctx, fact, info, [value], valuePath, false) ? leaf : undefined;
    case 'in':
      if (!Array.isArray(value) || value.length === 0 || value.some((v) => typeof v === 'object')) return bad("'in' takes a non-empty list of values");
      return checkValues(ctx, fact, info, value, valuePath, true) ? leaf : undefined;
  }
}

/** A choice question (or a closed stage fact) may only be compared with one of its values. */
function checkValues(ctx: ParseContext, fact: string, info: FactInfo, values: unknown[], path: Path, list: boolean): boolean {
  const allowed = info.question?.type === 'choice' ? (info.question.choices ?? []).map((c) => c.value) : info.values;
  if (!allowed) return true;
  let ok = true;
  values.forEach((v, i) => {
    if (typeof v !== 'string' || !allowed.includes(v)) {
      ok = false;
      add(ctx, 'unknown-value', list ? [...path, i] : path, `'${String(v)}' is not a value of '${fact}'`, `allowed: ${allowed.join(', ')}`);
    }
  });
  return ok;
}
