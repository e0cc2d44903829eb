/**
 * `npm run bench`: the speed and memory figures quoted in README.md, measured on this machine.
 * Plain JavaScript over the built dist/ (run `npm run build` first; `npm run bench` does).
 *
 *  1. A 1,000,000-pair CSV (about 24 MB, invented: bench/gen-paired.mjs) analysed with
 *     `tandem analyze --procedure paired-t` and its diagnostics: in-process, and as a CLI process
 *     with its peak memory; beside a pandas + scipy script doing the same on the same file
 *     (bench/pandas_paired.py, Debian's python3-pandas and python3-scipy), run in turns.
 *  2. The exact signed-rank p-value for n = 50.
 *  3. The CLI's start for a scripted command against a bare `node -e 0`.
 *  4. bench/size.mjs, when it exists.
 * Targets: analysis < 1 s, peak < 150 MB, at most half the pandas time; signed-rank n = 50 under
 * 20 ms; CLI start within 2.5 times bare node. Inputs are written under bench/out/ (git-ignored).
 *
 *   node bench/run.mjs [--rounds N] [--rows N]
 */
import { spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { parseArgs } from 'node:util';
import { generatePaired } from './gen-paired.mjs';

const here = dirname(fileURLToPath(import.meta.url));
const root = dirname(here);
const bin = join(root, 'dist/src/cli/bin.js');
const { values: opt } = parseArgs({ options: { rounds: { type: 'string', default: '3' }, rows: { type: 'string', default: '1000000' } } });
const rounds = Math.max(1, Number(opt.rounds));
const rows = Number(opt.rows);

if (!existsSync(bin)) {
  console.error('bench: dist/ is missing; run `npm run build` first (npm run bench does)');
  process.exit(2);
}

const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor((xs.length - 1) / 2)];
const fmtS = (ms) => `${(ms / 1000).toFixed(3)} s`;
const fmtMs = (ms) => `${ms.toFixed(1)} ms`;
const results = [];
const row = (what, value, target, ok, note = '') => results.push({ what, value, target, ok, note });

// ---- 1. the input ---------------------------------------------------------------------------
const csv = join(here, 'out', rows === 1_000_000 ? 'paired-1m.csv' : `paired-${rows}.csv`);
if (!existsSync(csv)) {
  process.stderr.write(`bench: generating ${csv} ...\n`);
  await generatePaired(csv, rows);
}
const sizeMB = statSync(csv).size / 1e6;
const shuffled = join(here, 'out', `paired-${rows}-shuffled-ids.csv`);
if (!existsSync(shuffled)) {
  process.stderr.write(`bench: generating ${shuffled} ...\n`);
  await generatePaired(shuffled, rows, undefined, true);
}
const ARGS = ['analyze', '--data', csv, '--procedure', 'paired-t', '--first', 'baffle_open_c', '--second', 'baffle_closed_c'];
const BY_ID = [...ARGS, '--id', 'rack'];
const BY_ROW = [...ARGS, '--pair-by-row-order'];

// ---- measuring a child process: wall time and peak resident memory --------------------------
const hasTime = existsSync('/usr/bin/time');
function child(cmd, args) {
  const t0 = performance.now();
  const r = hasTime
    ? spawnSync('/usr/bin/time', ['-f', '%M', cmd, ...args], { encoding: 'utf8', maxBuffer: 1 << 26 })
    : spawnSync(cmd, args, { encoding: 'utf8', maxBuffer: 1 << 26 });
  const wall = performance.now() - t0;
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} failed (${r.status}): ${r.stderr}`);
  const kb = hasTime ? Number(r.stderr.trim().split('\n').pop()) : NaN;
  return { wall, mb: kb / 1024, stdout: r.stdout };
}

// ---- in-process: run(argv, io) with output to a sink ----------------------------------------
const { run } = await import(pathToFileURL(join(root, 'dist/src/cli/run.js')).href);
const sink = () => {
  let bytes = 0;
  return { stdout: { write: (s) => (bytes += s.length) }, stderr: { write: (s) => process.stderr.write(s) }, stdin: process.stdin, interactive: false, color: false, env: {}, cwd: root, bytes: () => bytes };
};
async function inProcess(argv) {
  const io = sink();
  const t0 = performance.now();
  const code = await run(argv, io);
  const ms = performance.now() - t0;
  if (code !== 0) throw new Error(`tandem ${argv.join(' ')} exited ${code}`);
  return ms;
}

const python = ['/usr/bin/python3', 'python3'].find((p) => spawnSync(p, ['-c', 'import pandas, scipy'], { encoding: 'utf8' }).status === 0);
const times = { idIn: [], rowIn: [], idCli: [], rowCli: [], idMb: [], rowMb: [], pandas: [], pandasMb: [] };
await inProcess(BY_ID); // warm the file cache and the module cache once
for (let i = 0; i < rounds; i++) {
  process.stderr.write(`bench: round ${i + 1} of ${rounds}\n`);
  times.idIn.push(await inProcess(BY_ID));
  times.rowIn.push(await inProcess(BY_ROW));
  const a = child(process.execPath, [bin, ...BY_ID]);
  times.idCli.push(a.wall);
  times.idMb.push(a.mb);
  const b = child(process.execPath, [bin, ...BY_ROW]);
  times.rowCli.push(b.wall);
  times.rowMb.push(b.mb);
  if (python) {
    const p = child(python, [join(here, 'pandas_paired.py'), csv, 'rack', 'baffle_open_c', 'baffle_closed_c']);
    times.pandas.push(p.wall);
    times.pandasMb.push(p.mb);
  }
}
// The same by id, with the ids in scrambled order (tandem then checks them with a hash table).
const SHUFFLED = [...BY_ID.slice(0, 2), shuffled, ...BY_ID.slice(3)];
await inProcess(SHUFFLED);
const shuffledRuns = [];
for (let i = 0; i < rounds; i++) shuffledRuns.push(await inProcess(SHUFFLED));
const shuffledIn = median(shuffledRuns);
const shuffledCli = child(process.execPath, [bin, ...SHUFFLED]);
const pandasMs = python ? median(times.pandas) : NaN;
const label = `${rows.toLocaleString('en')} pairs, ${sizeMB.toFixed(1)} MB`;
row(`analyze paired-t + diagnostics, in-process, pairs by id (${label})`, fmtS(median(times.idIn)), '< 1 s', median(times.idIn) < 1000);
row('  the same, pairs by row order', fmtS(median(times.rowIn)), '< 1 s', median(times.rowIn) < 1000);
row('analyze as a CLI process, pairs by id (wall, with node start)', fmtS(median(times.idCli)), '< 1 s', median(times.idCli) < 1000);
row('  the same, pairs by row order', fmtS(median(times.rowCli)), '< 1 s', median(times.rowCli) < 1000);
row('  pairs by id, ids in scrambled order: in-process', fmtS(shuffledIn), '< 1 s', shuffledIn < 1000);
row('  pairs by id, ids in scrambled order: CLI process', fmtS(shuffledCli.wall), '< 1 s', shuffledCli.wall < 1000, `peak ${shuffledCli.mb.toFixed(0)} MB`);
row('peak memory of the CLI process, pairs by id', `${Math.max(...times.idMb).toFixed(0)} MB`, '< 150 MB', Math.max(...times.idMb) < 150, hasTime ? 'max of the rounds' : 'no /usr/bin/time');
row('  the same, pairs by row order', `${Math.max(...times.rowMb).toFixed(0)} MB`, '< 150 MB', Math.max(...times.rowMb) < 150);
if (python) {
  const versions = JSON.parse(child(python, ['-c', 'import json,pandas,scipy;print(json.dumps([pandas.__version__,scipy.__version__]))']).stdout);
  row(`pandas ${versions[0]} + scipy ${versions[1]} script, same file (wall, with Python start)`, fmtS(pandasMs), '', null, `peak ${Math.max(...times.pandasMb).toFixed(0)} MB`);
  row('tandem CLI / pandas time, pairs by id', (median(times.idCli) / pandasMs).toFixed(2), '<= 0.5', median(times.idCli) / pandasMs <= 0.5);
  row('  the same, pairs by row order', (median(times.rowCli) / pandasMs).toFixed(2), '<= 0.5', median(times.rowCli) / pandasMs <= 0.5);
} else {
  row('pandas + scipy script', 'not run', '', null, 'python3 with pandas and scipy not found');
}

// ---- 2. exact signed-rank p-value, n = 50 ----------------------------------------------------
{
  const { runProcedure } = await import(pathToFileURL(join(root, 'dist/src/stats/index.js')).href);
  // Fifty distinct differences (no ties, no zeros), so the exact null distribution applies.
  const second = Array.from({ length: 50 }, (_, i) => 40 + ((i * 37) % 50) / 10);
  const first = second.map((x, i) => x + (i % 2 ? 1 : -1) * (0.013 * (i + 1)) + 0.2);
  const once = () => {
    const t0 = performance.now();
    const r = runProcedure('signed-rank', { kind: 'paired', first, second }, { method: 'exact' });
    return { ms: performance.now() - t0, r };
  };
  const cold = once();
  const warm = Array.from({ length: 50 }, () => once().ms);
  row('signed-rank, exact p-value, n = 50 (first call)', fmtMs(cold.ms), '< 20 ms', cold.ms < 20, cold.r.variant ?? '');
  row('  the same, later calls (median of 50)', fmtMs(median(warm)), '< 20 ms', median(warm) < 20);
}

// ---- 3. CLI start ----------------------------------------------------------------------------
{
  const startRounds = 15;
  const bare = [];
  const version = [];
  const check = [];
  for (let i = 0; i < startRounds; i++) {
    bare.push(child(process.execPath, ['-e', '0']).wall);
    version.push(child(process.execPath, [bin, '--version']).wall);
    check.push(child(process.execPath, [bin, 'analyze', '--help']).wall);
  }
  const b = median(bare);
  row('bare `node -e 0` (median of 15)', fmtMs(b), '', null);
  row('`tandem --version` (median of 15)', `${fmtMs(median(version))} = ${(median(version) / b).toFixed(2)} x bare`, '<= 2.5 x', median(version) / b <= 2.5);
  row('`tandem analyze --help` (median of 15)', `${fmtMs(median(check))} = ${(median(check) / b).toFixed(2)} x bare`, '<= 2.5 x', median(check) / b <= 2.5);
}

// ---- report ----------------------------------------------------------------------------------
const cells = results.map((r) => [r.what, r.value, r.target, r.ok === null ? '' : r.ok ? 'met' : 'NOT MET', r.note]);
const head = ['measure', 'figure', 'target', '', 'note'];
const widths = head.map((h, i) => Math.max(h.length, ...cells.map((c) => c[i].length)));
const line = (c) => c.map((x, i) => x.padEnd(widths[i])).join('  ').trimEnd();
console.log(`\ntandem benchmark: node ${process.version}, ${(await import('node:os')).cpus().length} cores, ${rounds} round${rounds === 1 ? '' : 's'} (medians; load average ${(await import('node:os')).loadavg()[0].toFixed(1)})`);
console.log(line(head));
console.log(widths.map((w) => '-'.repeat(w)).join('  '));
for (const c of cells) console.log(line(c));

// ---- 4. another helper's size benchmark ------------------------------------------------------
const sizeBench = join(here, 'size.mjs');
if (existsSync(sizeBench)) {
  console.log('\nbench/size.mjs:');
  const r = spawnSync(process.execPath, [sizeBench], { stdio: 'inherit' });
  if (r.status !== 0) process.exitCode = 1;
}
