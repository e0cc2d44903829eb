/**
 * The only place that colours. A Style with colour off returns text unchanged, so reports are the
 * same bytes whether or not a terminal is attached (NO_COLOR, pipes, files, Markdown).
 */
import { Chalk } from 'chalk';

export interface Style {
  bold(s: string): string;
  dim(s: string): string;
  good(s: string): string;
  warn(s: string): string;
  bad(s: string): string;
  accent(s: string): string;
}

const plain: Style = { bold: (s) => s, dim: (s) => s, good: (s) => s, warn: (s) => s, bad: (s) => s, accent: (s) => s };

export function makeStyle(color: boolean): Style {
  if (!color) return plain;
  const c = new Chalk({ level: 1 });
  return { bold: c.bold, dim: c.dim, good: c.green, warn: c.yellow, bad: c.red, accent: c.cyan };
}

/** A plain-text table: columns padded to their widest cell; `right` aligns the given columns right. */
export function textTable(rows: string[][], opts: { right?: number[]; indent?: string } = {}): string {
  const widths: number[] = [];
  for (const r of rows) r.forEach((c, i) => (widths[i] = Math.max(widths[i] ?? 0, c.length)));
  const right = new Set(opts.right ?? []);
  return rows
    .map((r) => (opts.indent ?? '') + r.map((c, i) => (right.has(i) ? c.padStart(widths[i]) : c.padEnd(widths[i]))).join('  ').trimEnd())
    .join('\n');
}

/** A Markdown table (GitHub-flavoured); pipes inside cells are escaped. */
export function markdownTable(header: string[], rows: string[][], right: number[] = []): string {
  const esc = (s: string): string => s.replace(/\|/g, '\\|');
  const sep = header.map((_, i) => (right.includes(i) ? '---:' : '---'));
  return [header, sep, ...rows].map((r, k) => '| ' + (k === 1 ? r : r.map(esc)).join(' | ') + ' |').join('\n');
}

/** A number for people: `digits` significant digits, no exponent for ordinary magnitudes. */
export function fmt(x: number | null | undefined, digits = 4): string {
  if (x === null || x === undefined) return 'n/a';
  if (Number.isNaN(x)) return 'n/a';
  if (!Number.isFinite(x)) return x > 0 ? 'inf' : '-inf';
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a >= 1e-4 && a < 1e9) return String(Number(x.toPrecision(digits)));
  return x.toExponential(digits - 1);
}

/** A p-value as people read it: three significant digits, "< 1e-16" below machine resolution. */
export function fmtP(p: number): string {
  if (Number.isNaN(p)) return 'n/a';
  if (p < 1e-16) return '< 1e-16';
  if (p < 1e-4) return p.toExponential(2);
  return String(Number(p.toPrecision(3)));
}
