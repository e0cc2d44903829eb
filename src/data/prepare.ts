/**
 * From a layout to the procedure's input: which columns to read, and how to form pairs, groups
 * or crossover subjects from them. Pure apart from nothing: the table is already in memory.
 */
import { InputError } from '../errors.js';
import type { ProcedureInput } from '../stats/types.js';
import { prepareCrossover } from './crossover.js';
import { prepareColumns, prepareGroups } from './groups.js';
import { prepareLong } from './pair-long.js';
import { prepareWide } from './pair-wide.js';
import type { ColumnRequest, LayoutSpec, OutcomeSpec, PreparedData, Table } from './types.js';

const LAYOUTS_FOR: Record<ProcedureInput['kind'], LayoutSpec['layout'][]> = {
  paired: ['wide', 'long'],
  independent: ['groups', 'columns'],
  crossover: ['crossover'],
};

/** Refuses a layout that cannot hold the design (e.g. group columns for a paired procedure). */
export function checkLayout(design: ProcedureInput['kind'], layout: LayoutSpec['layout'], procedure: string): void {
  if (!LAYOUTS_FOR[design].includes(layout)) {
    throw new InputError(
      `${procedure} needs ${design} data (layout ${LAYOUTS_FOR[design].join(' or ')}); the data are described as layout '${layout}'`,
    );
  }
}

/** The columns a layout reads, each with its role for messages. */
export function columnRequests(m: LayoutSpec, outcome: OutcomeSpec): ColumnRequest[] {
  const value = (name: string, role: string): ColumnRequest => ({ name, role, kind: outcome.binary ? 'category' : 'number' });
  const text = (name: string, role: string): ColumnRequest => ({ name, role, kind: 'category' });
  const id = (name: string | undefined): ColumnRequest[] => (name === undefined ? [] : [text(name, 'id')]);
  switch (m.layout) {
    case 'wide':
      return [...id(m.id), value(m.first, 'first value'), value(m.second, 'second value')];
    case 'long':
      return [text(m.id, 'id'), text(m.condition, 'condition'), value(m.value, 'value')];
    case 'groups':
      return [...id(m.id), text(m.group, 'group'), value(m.value, 'value')];
    case 'columns':
      return [value(m.first, 'first group'), value(m.second, 'second group')];
    case 'crossover':
      return [...id(m.id), text(m.sequence, 'sequence'), { name: m.period1, role: 'period 1', kind: 'number' }, { name: m.period2, role: 'period 2', kind: 'number' }];
  }
}

export function prepare(table: Table, m: LayoutSpec, outcome: OutcomeSpec): PreparedData {
  switch (m.layout) {
    case 'wide':
      return prepareWide(table, m, outcome);
    case 'long':
      return prepareLong(table, m, outcome);
    case 'groups':
      return prepareGroups(table, m, outcome);
    case 'columns':
      return prepareColumns(table, m, outcome);
    case 'crossover':
      return prepareCrossover(table, m, outcome);
  }
}
