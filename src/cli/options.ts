/**
 * Option parsing for every command, on node:util parseArgs. Unknown options and bad values
 * become InputError with the allowed set named.
 */
import { parseArgs } from 'node:util';
import { InputError } from '../errors.js';

export type OptionSpec = Record<string, { type: 'string' | 'boolean'; short?: string; multiple?: boolean }>;

export interface Parsed {
  values: Record<string, string | boolean | string[] | boolean[] | undefined>;
  positionals: string[];
}

/**
 * parseArgs reads `--null -0.5` as two options; a string option followed by something that reads
 * as a negative number takes it as its value (`--null=-0.5`), so negative values need no '='.
 */
function joinNegativeValues(argv: string[], spec: OptionSpec): string[] {
  const out: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const next = argv[i + 1];
    const name = a.startsWith('--') ? a.slice(2) : undefined;
    if (name && spec[name]?.type === 'string' && next !== undefined && /^-(\d|\.\d|Infinity)/.test(next)) {
      out.push(`${a}=${next}`);
      i++;
    } else out.push(a);
  }
  return out;
}

export function parseOptions(argv: string[], spec: OptionSpec, command: string): Parsed {
  try {
    const { values, positionals } = parseArgs({ args: joinNegativeValues(argv, spec), options: { ...spec, help: { type: 'boolean', short: 'h' } }, allowPositionals: true, strict: true });
    return { values: values as Parsed['values'], positionals };
  } catch (err) {
    const allowed = Object.keys(spec).map((k) => `--${k}`).join(', ');
    const msg = err instanceof Error ? err.message.replace(/\. To specify.*$/s, '') : String(err);
    throw new InputError(`${msg}; '${command}' takes: ${allowed || '(no options)'}, --help`);
  }
}

export function stringOpt(p: Parsed, name: string): string | undefined {
  const v = p.values[name];
  return typeof v === 'string' ? v : undefined;
}

export function boolOpt(p: Parsed, name: string): boolean {
  return p.values[name] === true;
}

/** A number option within [min, max] (open ends when `open` is set); names the option on error. */
export function numberOpt(
  p: Parsed,
  name: string,
  range: { min?: number; max?: number; openMin?: boolean; openMax?: boolean; integer?: boolean } = {},
): number | undefined {
  const raw = stringOpt(p, name);
  if (raw === undefined) return undefined;
  const v = Number(raw.trim());
  const { min, max, openMin, openMax, integer } = range;
  const bad =
    raw.trim() === '' ||
    !Number.isFinite(v) ||
    (integer && !Number.isInteger(v)) ||
    (min !== undefined && (openMin ? v <= min : v < min)) ||
    (max !== undefined && (openMax ? v >= max : v > max));
  if (bad) {
    const lo = min === undefined ? '-inf' : String(min);
    const hi = max === undefined ? 'inf' : String(max);
    const interval = `${openMin ? '(' : '['}${lo}, ${hi}${openMax ? ')' : ']'}`;
    throw new InputError(`--${name} must be ${integer ? 'a whole number' : 'a number'} in ${interval}; got '${raw}'`);
  }
  return v;
}

export function choiceOpt<T extends string>(p: Parsed, name: string, allowed: readonly T[]): T | undefined {
  const raw = stringOpt(p, name);
  if (raw === undefined) return undefined;
  if (!(allowed as readonly string[]).includes(raw)) {
    throw new InputError(`--${name} must be one of ${allowed.join(', ')}; got '${raw}'`);
  }
  return raw as T;
}
