/**
 * `tandem size`: how many pairs (or units per group) a study needs, the power of a given size,
 * or the smallest detectable difference, with what pairing buys and a power curve. Inputs come
 * from options, from a plan's planning section (`tandem size PLAN`), or both (options win);
 * `--plan FILE --force` writes the inputs back into a plan, keeping the rest of the file.
 */
import { existsSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import type { IO } from '../io.js';
import { EXIT } from '../exit-codes.js';
import { boolOpt, choiceOpt, parseOptions, stringOpt, type Parsed } from '../options.js';
import { InputError, OutputError } from '../../errors.js';
import { loadYaml } from '../../yaml/load.js';
import { writeFileAtomic } from '../../fs/atomic.js';
import { makeStyle } from '../../report/style.js';
import { renderSize, sizeJson, type SizeContext } from '../../report/size.js';
import { planSize, resolveInputs, type RawSizeInputs } from '../../size/index.js';
import { OPTION_NAMES, type RawKey } from '../../size/inputs.js';
import { PLANNING_KEYS, sizeInputsFromPlan } from '../../size/plan-inputs.js';


const HELP = `Usage: tandem size [PLAN] [options]

How many pairs (paired design) or units per group (independent groups) are needed to detect a
difference, with exact power from the noncentral t distribution; or the power of a given size;
or the smallest difference a given size can detect. Shows what pairing buys across correlations
and a power curve.

The effect (first minus second):
  --difference D        expected mean difference, in the outcome's units
  --sd S                SD of single measurements (independent groups: of the first group)
  --sd2 S               independent: SD of the second group when it differs (Welch's test)
  --sd-diff S           paired: SD of the within-pair differences
  --rho R               paired: correlation between the two members of a pair, in (-1, 1);
                        with --sd gives SD of differences = S * sqrt(2 (1 - R))
  --effect-size E       standardized instead of --difference: d_z (difference / SD of
                        differences) for paired designs, or d (difference / SD) for two groups;
                        with --rho a paired effect size is read as d
The question:
  --design paired|independent
  --alpha A             significance level, default 0.05
  --power P             target power, default 0.8
  --alternative two-sided|greater|less   default two-sided ("greater": first above second)
  --ratio R             independent: allocation n2/n1, default 1 (n2 = ceil(R * n1))
  --attrition F         expected share lost, in [0, 1); recruit = ceil(n / (1 - F)) per group
  --n N                 pairs or first-group size: with an effect, the power at N; without one,
                        the smallest detectable difference at N and --power
  --margin M            equivalence: show the difference lies within -M..+M (two one-sided
                        tests); the expected difference defaults to 0
Output:
  --unit TEXT           the outcome's unit for the sentence (e.g. mm); a plan supplies its own
  --json                machine-readable result (n, total, power, recruit, inputs, ...)
  --plan FILE           write these inputs into FILE's planning section (needs --force)
  --force               allow --plan to change an existing file

PLAN: an analysis plan (tandem-plan/1) whose optional 'planning' section and design family
supply the inputs; options given on the command line take precedence.

Examples:
  tandem size --design paired --difference 2.5 --sd-diff 4 --attrition 0.1 --unit mm
  tandem size --design independent --effect-size 0.5 --power 0.9
  tandem size --design paired --sd 12 --rho 0.6 --n 30 --unit g
  tandem size --design independent --difference 0.4 --sd 1.1 --margin 1.5
  tandem size kiln-glaze.plan.yaml --power 0.9

Exit codes: 0 ok, 2 bad input (names the option and the allowed range), 3 plan not written.
`;

const SPEC = {
  design: { type: 'string' }, difference: { type: 'string' }, sd: { type: 'string' }, sd2: { type: 'string' },
  'sd-diff': { type: 'string' }, rho: { type: 'string' }, 'effect-size': { type: 'string' }, alpha: { type: 'string' },
  power: { type: 'string' }, alternative: { type: 'string' }, ratio: { type: 'string' }, attrition: { type: 'string' },
  n: { type: 'string' }, margin: { type: 'string' }, unit: { type: 'string' }, json: { type: 'boolean' },
  plan: { type: 'string' }, force: { type: 'boolean' },
} as const;

/** Options as raw inputs; ranges are checked once, in resolveInputs, with the option's name. */
function optionInputs(p: Parsed): RawSizeInputs {
  const num = (name: string): number | undefined => {
    const text = stringOpt(p, name);
    if (text === undefined) return undefined;
    const v = Number(text.trim());
    if (text.trim() === '' || Number.isNaN(v)) throw new InputError(`--${name} must be a number; got '${text}'`);
    return v;
  };
  const raw: RawSizeInputs = {
    design: choiceOpt(p, 'design', ['paired', 'independent'] as const),
    difference: num('difference'), sd: num('sd'), sd2: num('sd2'), sdDiff: num('sd-diff'), rho: num('rho'),
    effectSize: num('effect-size'), alpha: num('alpha'), power: num('power'),
    alternative: choiceOpt(p, 'alternative', ['two-sided', 'greater', 'less'] as const),
    ratio: num('ratio'), attrition: num('attrition'), n: num('n'), margin: num('margin'),
  };
  for (const k of Object.keys(raw) as RawKey[]) if (raw[k] === undefined) delete raw[k];
  return raw;
}

export default async function size(argv: string[], io: IO): Promise<number> {
  const p = parseOptions(argv, SPEC, 'size');
  if (p.values.help) {
    io.stdout.write(HELP);
    return EXIT.ok;
  }
  if (p.positionals.length > 1) throw new InputError(`size takes at most one plan file; got ${p.positionals.join(', ')}`);
  const target = stringOpt(p, 'plan');
  const targetPath = target === undefined ? undefined : resolve(io.cwd, target);
  if (targetPath !== undefined) {
    if (!existsSync(targetPath)) throw new InputError(`--plan ${target}: no such plan file (write one with 'tandem advise --plan FILE', then add the planning inputs here)`);
    if (!boolOpt(p, 'force')) throw new OutputError(`${target} exists; nothing was written (use --force to update its planning section)`);
  }

  const opts = optionInputs(p);
  let raw: RawSizeInputs = opts;
  let context: SizeContext = {};
  let fromPlan = new Set<RawKey>();
  let planFile: string | undefined;
  if (p.positionals.length === 1) {
    planFile = p.positionals[0];
    const loaded = loadYaml(await readText(resolve(io.cwd, planFile), planFile), planFile);
    if (loaded.problems.length) throw new InputError(`${planFile} cannot be read as YAML`, loaded.problems);
    const fromFile = sizeInputsFromPlan(loaded);
    if (fromFile.raw.design === undefined && opts.design === undefined) {
      throw new InputError(`${planFile}: the plan's design is '${fromFile.family || 'not stated'}'; tandem size plans paired or independent comparisons (or give --design)`);
    }
    if (opts.design && fromFile.raw.design && opts.design !== fromFile.raw.design) {
      throw new InputError(`--design ${opts.design} contradicts the plan, whose design is ${fromFile.raw.design}`);
    }
    // Options replace the plan's values; an option naming the effect replaces the plan's whole effect.
    const planRaw = { ...fromFile.raw };
    if (opts.difference !== undefined || opts.effectSize !== undefined) { delete planRaw.difference; delete planRaw.effectSize; }
    if (opts.sdDiff !== undefined || opts.rho !== undefined) { delete planRaw.sdDiff; delete planRaw.rho; }
    raw = { ...planRaw, ...opts };
    fromPlan = new Set([...fromFile.fromPlan].filter((k) => opts[k] === undefined && planRaw[k] !== undefined));
    context = fromFile.context;
  }
  const unit = stringOpt(p, 'unit');
  if (unit !== undefined) context = { ...context, outcomeUnit: unit };
  const name = (k: RawKey): string => (fromPlan.has(k) ? `planning value ${k} in ${planFile}` : OPTION_NAMES[k]);

  const resolved = resolveInputs(raw, name);
  const plan = planSize(resolved);
  if (boolOpt(p, 'json')) io.stdout.write(JSON.stringify(sizeJson(plan, raw, context), null, 2) + '\n');
  else io.stdout.write(renderSize(plan, context, makeStyle(io.color)));

  if (targetPath !== undefined && target !== undefined) {
    await writePlanning(targetPath, target, raw, io);
  }
  return EXIT.ok;
}

async function readText(path: string, shown: string): Promise<string> {
  try {
    return await readFile(path, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    throw new InputError(`cannot read ${shown}: ${code === 'ENOENT' ? 'no such file' : err instanceof Error ? err.message : String(err)}`);
  }
}

/** Sets the plan's planning keys to these inputs (removing stale ones), keeping everything else. */
async function writePlanning(path: string, shown: string, raw: RawSizeInputs, io: IO): Promise<void> {
  const loaded = loadYaml(await readText(path, shown), shown);
  if (loaded.problems.length) throw new InputError(`--plan ${shown} cannot be read as YAML; nothing was written`, loaded.problems);
  const v = loaded.value as Record<string, unknown> | null;
  if (!v || typeof v !== 'object' || v.format !== 'tandem-plan/1') throw new InputError(`--plan ${shown} is not a tandem-plan/1 file; nothing was written`);
  const fam = (v.design as Record<string, unknown> | undefined)?.family;
  if (raw.design && fam !== raw.design) throw new InputError(`--plan ${shown} plans a ${String(fam)} design, not ${raw.design}; nothing was written`);
  const doc = loaded.doc;
  for (const k of PLANNING_KEYS) {
    const val = raw[k as RawKey];
    if (val === undefined) {
      if (doc.hasIn(['planning', k])) doc.deleteIn(['planning', k]);
    } else {
      doc.setIn(['planning', k], val);
    }
  }
  await writeFileAtomic(path, doc.toString(), { force: true });
  io.stderr.write(`tandem size: planning inputs written to ${shown}\n`);
}
