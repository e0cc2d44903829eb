/**
 * With --data: the colleague's procedure and the recommended one, recomputed on the same file and
 * shown side by side, plus an account of the pairing. The file is read by the data layer
 * (src/data) with the record's mapping (or the plan's); the procedures run through runProcedure.
 *
 * The colleague's procedure is fed the data as the colleague must have seen them: an
 * independent-groups procedure on paired data gets every non-missing value of each condition; a
 * paired procedure on unlinked columns gets the values paired by row position; a plain paired
 * procedure on a crossover gets each subject's two values by condition, ignoring the period.
 */
import { columnRequests, prepare } from '../data/prepare.js';
import { readTable } from '../data/read.js';
import type { LayoutSpec, OutcomeSpec, PreparedData, Table } from '../data/types.js';
import { InputError, StatsError } from '../errors.js';
import { procedureDesign, runProcedure } from '../stats/index.js';
import type { ProcedureId, ProcedureInput, ProcedureOptions, TestResult } from '../stats/types.js';
import { checkData } from './check-data.js';
import type { AuditContext, Collector } from './context.js';
import { accountPairing, type PairingAccount } from './pairing.js';
import { PROCEDURE_LABEL } from './procedure-names.js';
import type { DataComparison } from './types.js';

export interface DataRun {
  comparison: DataComparison;
  account: PairingAccount;
}

/** Reads the data file and runs both procedures; findings go to `out`. */
export function auditOnData(path: string, shown: string, ctx: AuditContext, out: Collector): DataRun {
  const mapping = ctx.record.mapping as LayoutSpec | undefined;
  if (!mapping) {
    throw new InputError(`--data needs to know how to read ${shown}: add a data.mapping block to the record (layout wide, long, groups, columns or crossover, with the column names), or refer to a plan file with study.planFile`);
  }
  const answers = ctx.record.answers ?? {};
  const outcome: OutcomeSpec = { binary: answers.outcome_type === 'binary', ...(typeof answers.event === 'string' && answers.event ? { event: answers.event } : {}) };
  const table = readTable(path, columnRequests(mapping, outcome), { ...(ctx.record.missing ? { missing: ctx.record.missing } : {}), ...(ctx.record.delimiter ? { delimiter: ctx.record.delimiter } : {}) }, shown);
  const account = accountPairing(table, mapping, outcome);
  const prepared = tryPrepare(table, mapping, outcome);

  const colleague = ctx.used
    ? runSide(ctx.used, colleagueInput(ctx.used, mapping, account, prepared), optionsFor(ctx, 'colleague'), 'as the colleague ran it')
    : { result: null, why: 'the record does not name a procedure that tandem can run' };
  const how = ctx.used ? feedNote(ctx.used, mapping, prepared) : undefined;
  if (how) account.lines.push(how);
  // When the colleague used the recommended procedure, one column says it all.
  const recId = ctx.recommended && ctx.recommended !== ctx.used ? ctx.recommended : null;
  const recommended = recId
    ? runSide(recId, prepared && procedureDesign(recId) === prepared.input.kind ? prepared.input : undefined, optionsFor(ctx, 'recommended'), 'as recommended')
    : null;
  const comparison: DataComparison = {
    file: shown,
    // The account already names unmatched ids; keep the data layer's other warnings.
    pairing: [...account.lines, ...(prepared?.warnings ?? []).filter((w) => !/unmatched id/.test(w))],
    colleague: { label: ctx.used ? `${PROCEDURE_LABEL[ctx.used]}${ctx.used === ctx.recommended ? ' (also the recommended procedure)' : ''}` : ctx.usedLabel, ...colleague },
    recommended: recId ? { label: `${PROCEDURE_LABEL[recId]}${ctx.recommendedByDefault ? ' (default for the stated design)' : ''}`, ...recommended! } : null,
  };
  // A one-sided test is often reported with the two-sided interval: compare like with like.
  let interval = colleague.result;
  if (interval && ctx.used && ctx.r.ci?.lower && ctx.r.ci.upper && interval.alternative !== 'two-sided') {
    interval = runSide(ctx.used, colleagueInput(ctx.used, mapping, account, prepared), { ...optionsFor(ctx, 'colleague'), alternative: 'two-sided' }, '').result;
  }
  checkData(ctx, out, account, comparison, interval);
  return { comparison, account };
}

function tryPrepare(table: Table, m: LayoutSpec, outcome: OutcomeSpec): PreparedData | undefined {
  try {
    return prepare(table, m, outcome);
  } catch (err) {
    // Repeated ids are findings here, not bad input: accountPairing has counted them.
    if (err instanceof InputError && err.problems.length > 0 && err.problems.every((p) => p.code === 'duplicate-id')) return undefined;
    throw err;
  }
}

/** The data as the colleague's procedure must have taken them. */
function colleagueInput(id: ProcedureId, m: LayoutSpec, acc: PairingAccount, prepared?: PreparedData): ProcedureInput | undefined {
  const kind = procedureDesign(id);
  if (prepared && prepared.input.kind === kind) return prepared.input;
  if (acc.duplicates.length > 0) return undefined;
  if (kind === 'independent') return { kind: 'independent', first: acc.firstValues, second: acc.secondValues };
  if (kind === 'paired' && m.layout === 'crossover') return { kind: 'paired', first: acc.firstValues, second: acc.secondValues };
  if (kind === 'paired') {
    const n = Math.min(acc.firstValues.length, acc.secondValues.length);
    return { kind: 'paired', first: acc.firstValues.slice(0, n), second: acc.secondValues.slice(0, n) };
  }
  return undefined;
}

/** Says how the colleague's procedure was fed when the data's layout is not its own. */
function feedNote(id: ProcedureId, m: LayoutSpec, prepared?: PreparedData): string | undefined {
  const kind = procedureDesign(id);
  if (prepared && prepared.input.kind === kind) return undefined;
  if (kind === 'independent') return "for the colleague's independent-groups procedure every available value of each condition was used, ignoring the pairs";
  if (kind === 'paired' && m.layout === 'crossover') return "for the colleague's paired procedure each subject's two values were taken by condition, ignoring the period";
  if (kind === 'paired') return "for the colleague's paired procedure the values were paired by their position in each list, as a row-by-row analysis does";
  return undefined;
}

function optionsFor(ctx: AuditContext, side: 'colleague' | 'recommended'): Partial<ProcedureOptions> {
  const r = ctx.r;
  const margin = r.equivalence?.margin?.value ?? ctx.rec?.procedure.margin;
  if (side === 'colleague') {
    return { alternative: r.alternative ?? 'two-sided', confidence: ctx.confidence, ...(margin !== undefined ? { margin } : {}) };
  }
  const p = ctx.rec?.procedure;
  if (!p) return { alternative: r.alternative ?? 'two-sided', confidence: ctx.confidence, ...(margin !== undefined ? { margin } : {}) };
  return { alternative: p.alternative, confidence: p.confidence ?? 0.95, ...(margin !== undefined ? { margin } : {}) };
}

function runSide(id: ProcedureId, input: ProcedureInput | undefined, o: Partial<ProcedureOptions>, how: string): { result: TestResult | null; why?: string } {
  if (!input) return { result: null, why: `the data cannot be arranged for the ${PROCEDURE_LABEL[id]} ${how} (see the pairing account)` };
  try {
    return { result: runProcedure(id, input, o) };
  } catch (err) {
    if (err instanceof StatsError) return { result: null, why: err.message };
    throw err;
  }
}
