/**
 * Shapes shared by the data layer: which columns to read, the columns read, and the data made
 * ready for a procedure.
 */
import type { Problem } from '../problems.js';
import type { ProcedureInput } from '../stats/types.js';
import type { Delimiter, DelimiterChoice } from './delimiter.js';

/** `number` columns become a Float64Array (NaN = missing); `category` columns become codes. */
export type ColumnKind = 'number' | 'category';

export interface ColumnRequest {
  name: string;
  kind: ColumnKind;
  /** What the column is for, used in messages ("id", "first condition", "group"...). */
  role: string;
}

export interface NumberColumn {
  kind: 'number';
  name: string;
  /** 0-based field index in the header. */
  index: number;
  /**
   * One value per data row; NaN marks a missing cell (a literal NaN is refused when reading).
   * A plain array, so that a layout with nothing to drop can hand it to a procedure as it is.
   */
  values: number[];
  missing: number;
}

export interface CategoryColumn {
  kind: 'category';
  name: string;
  index: number;
  /** One code per data row, numbering the distinct values in order of appearance; -1 = missing. */
  codes: Int32Array;
  /** How many distinct values. */
  levelCount: number;
  /** The text of a code. */
  level(code: number): string;
  /** The code of a text, or -1 when it does not occur. */
  find(value: string): number;
  missing: number;
}

export type Column = NumberColumn | CategoryColumn;

export interface Table {
  file: string;
  header: string[];
  delimiter: Delimiter;
  /** Which reader produced it: the plain scan, or papaparse for quoted files. */
  parser: 'fast' | 'full';
  /** Data rows (blank lines are skipped and not counted). */
  rows: number;
  /** The 1-based file line on which data row r (0-based) starts. */
  lineOf(row: number): number;
  columns: Record<string, Column>;
}

export interface ReadOptions {
  delimiter?: DelimiterChoice;
  /** Missing markers; the empty cell is always missing. Default: empty and NA. */
  missing?: readonly string[];
  /** 'auto' scans plainly and falls back to papaparse at the first double quote. */
  parser?: 'auto' | 'fast' | 'full';
  /** Bytes read at a time by the plain scan (tests make it tiny to cross chunk borders). */
  chunkSize?: number;
}

/** The data made ready for one procedure, with an account of what was dropped and why. */
export interface PreparedData {
  input: ProcedureInput;
  layout: string;
  /** Names of the two sides as the data call them (columns or levels). */
  sides: { first: string; second: string };
  /** Crossover only: the sequence values (first condition in period 1, and the other). */
  sequences?: { firstThenSecond: string; secondThenFirst: string };
  counts: {
    /** Data rows read. */
    rows: number;
    /** Complete pairs (paired), subjects (crossover). */
    pairs?: number;
    first?: number;
    second?: number;
    /** Pairs, subjects or values left out because something was missing. */
    dropped: number;
  };
  /** Statements about the data handling: levels chosen, pairs dropped, ids unmatched. */
  notes: string[];
  /** Things the reader must see: unequal counts, unmatched ids. */
  warnings: string[];
}

export type { Problem };

/**
 * Where the values are, by layout: the plan's DataMapping (src/plan/types.ts) fits it, and quick
 * mode may leave levels unnamed. `groups` may name an id column, so that a unit measured twice
 * within independent groups is caught (pseudo-replication).
 */
export type LayoutSpec =
  | { layout: 'wide'; first: string; second: string; id?: string; pairBy: 'id' | 'row-order' }
  | { layout: 'long'; id: string; condition: string; value: string; firstLevel?: string; secondLevel?: string }
  | { layout: 'groups'; group: string; value: string; firstLevel?: string; secondLevel?: string; id?: string }
  | { layout: 'columns'; first: string; second: string }
  | {
      layout: 'crossover';
      id?: string;
      sequence: string;
      firstThenSecond?: string;
      secondThenFirst?: string;
      period1: string;
      period2: string;
    };

/** One layout of the union, for the module that prepares it: `LayoutOf<'long'>`. */
export type LayoutOf<K extends LayoutSpec['layout']> = Extract<LayoutSpec, { layout: K }>;

/** The outcome's kind: binary outcomes are read as text and mapped to 0/1. */
export interface OutcomeSpec {
  binary: boolean;
  /** The value that counts as the event (binary only). */
  event?: string;
}
