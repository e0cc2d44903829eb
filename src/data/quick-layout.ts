/**
 * The layout of quick mode (`tandem analyze --data FILE --procedure ID ...`), from the column
 * options given. The design of the procedure decides which options fit; an option that does not
 * fit is refused by name rather than ignored.
 *
 *   paired, one row per unit:          --first A --second B [--id ID | --pair-by-row-order]
 *   paired, one row per measurement:   --id ID --condition C --value V [--first-level X --second-level Y]
 *   independent, group column:         --group G --value V [--first-level X --second-level Y] [--id ID]
 *   independent, one column per group: --first A --second B
 *   2x2 crossover:                     --sequence S --period1 P1 --period2 P2 --first-then-second X [--second-then-first Y] [--id ID]
 */
import { InputError } from '../errors.js';
import type { ProcedureInput } from '../stats/types.js';
import type { LayoutSpec } from './types.js';

export interface QuickColumns {
  first?: string;
  second?: string;
  id?: string;
  group?: string;
  value?: string;
  condition?: string;
  firstLevel?: string;
  secondLevel?: string;
  sequence?: string;
  period1?: string;
  period2?: string;
  firstThenSecond?: string;
  secondThenFirst?: string;
  pairByRowOrder?: boolean;
}

const OPTION: Record<keyof QuickColumns, string> = {
  first: '--first', second: '--second', id: '--id', group: '--group', value: '--value', condition: '--condition',
  firstLevel: '--first-level', secondLevel: '--second-level', sequence: '--sequence', period1: '--period1', period2: '--period2',
  firstThenSecond: '--first-then-second', secondThenFirst: '--second-then-first', pairByRowOrder: '--pair-by-row-order',
};

const SHAPES: Record<LayoutSpec['layout'], { required: (keyof QuickColumns)[]; optional: (keyof QuickColumns)[]; words: string }> = {
  wide: { required: ['first', 'second'], optional: ['id', 'pairByRowOrder'], words: '--first A --second B [--id ID | --pair-by-row-order]' },
  long: { required: ['id', 'condition', 'value'], optional: ['firstLevel', 'secondLevel'], words: '--id ID --condition C --value V [--first-level X --second-level Y]' },
  groups: { required: ['group', 'value'], optional: ['firstLevel', 'secondLevel', 'id'], words: '--group G --value V [--first-level X --second-level Y] [--id ID]' },
  columns: { required: ['first', 'second'], optional: [], words: '--first A --second B (one column per group)' },
  crossover: { required: ['sequence', 'period1', 'period2'], optional: ['firstThenSecond', 'secondThenFirst', 'id'], words: '--sequence S --period1 P1 --period2 P2 --first-then-second X [--id ID]' },
};

export function quickLayout(design: ProcedureInput['kind'], procedure: string, c: QuickColumns): LayoutSpec {
  const layout: LayoutSpec['layout'] =
    design === 'paired' ? (c.condition !== undefined ? 'long' : 'wide') : design === 'independent' ? (c.group !== undefined ? 'groups' : 'columns') : 'crossover';
  const shape = SHAPES[layout];
  const given = (Object.keys(OPTION) as (keyof QuickColumns)[]).filter((k) => c[k] !== undefined && c[k] !== false);
  const extra = given.filter((k) => !shape.required.includes(k) && !shape.optional.includes(k));
  const missing = shape.required.filter((k) => c[k] === undefined);
  if (extra.length || missing.length) {
    const others = (Object.keys(SHAPES) as LayoutSpec['layout'][]).filter((l) => l !== layout && fits(l, design));
    const alt = others.map((l) => `\n  or: ${SHAPES[l].words}`).join('');
    const what = [
      missing.length ? `missing ${missing.map((k) => OPTION[k]).join(', ')}` : '',
      extra.length ? `${extra.map((k) => OPTION[k]).join(', ')} ${extra.length === 1 ? 'does' : 'do'} not fit` : '',
    ].filter(Boolean).join('; ');
    throw new InputError(`${procedure} reads ${design} data: ${what}\n  columns: ${shape.words}${alt}`);
  }
  switch (layout) {
    case 'wide':
      return { layout, first: c.first!, second: c.second!, ...(c.id !== undefined ? { id: c.id } : {}), pairBy: c.pairByRowOrder ? 'row-order' : 'id' };
    case 'long':
      return { layout, id: c.id!, condition: c.condition!, value: c.value!, firstLevel: c.firstLevel, secondLevel: c.secondLevel };
    case 'groups':
      return { layout, group: c.group!, value: c.value!, firstLevel: c.firstLevel, secondLevel: c.secondLevel, ...(c.id !== undefined ? { id: c.id } : {}) };
    case 'columns':
      return { layout, first: c.first!, second: c.second! };
    case 'crossover':
      return { layout, sequence: c.sequence!, period1: c.period1!, period2: c.period2!, firstThenSecond: c.firstThenSecond, secondThenFirst: c.secondThenFirst, ...(c.id !== undefined ? { id: c.id } : {}) };
  }
}

function fits(layout: LayoutSpec['layout'], design: ProcedureInput['kind']): boolean {
  return design === 'paired' ? layout === 'wide' || layout === 'long' : design === 'independent' ? layout === 'groups' || layout === 'columns' : layout === 'crossover';
}
