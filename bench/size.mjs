/**
 * Speed of `tandem size` solves: each case is solved once to warm up, then timed over several
 * rounds; the median is printed against the 20 ms target for any single solve. Plain JavaScript
 * over the built dist/ (run `npm run build` first; `npm run bench` does).
 *
 *   node bench/size.mjs [--rounds N]
 */
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const dist = join(here, '..', 'dist', 'src');
const load = (p) => import(pathToFileURL(join(dist, p)).href);
const { resolveInputs, planSize } = await load('size/index.js');
const { sampleSize, detectableDifference, powerAtSize } = await load('size/solve.js');
const { noncentralTCdf, noncentralTSf } = await load('stats/noncentral-t.js');

const arg = process.argv.indexOf('--rounds');
const ROUNDS = arg > 0 ? Number(process.argv[arg + 1]) : 25;
const TARGET_MS = 20;

const cases = [
  ['paired n, difference 2.5, SD of differences 4', () => sampleSize(resolveInputs({ design: 'paired', difference: 2.5, sdDiff: 4 }).spec)],
  ['two groups n, d = 0.2 (394 per group)', () => sampleSize(resolveInputs({ design: 'independent', effectSize: 0.2 }).spec)],
  ['two groups n, d = 0.01 (about 157,000 per group)', () => sampleSize(resolveInputs({ design: 'independent', effectSize: 0.01 }).spec)],
  ['Welch n, SDs 3 and 5, ratio 2', () => sampleSize(resolveInputs({ design: 'independent', difference: 1, sd: 3, sd2: 5, ratio: 2 }).spec)],
  ['one-sided paired n, alpha 0.01, power 0.95', () => sampleSize(resolveInputs({ design: 'paired', effectSize: 0.3, alpha: 0.01, power: 0.95, alternative: 'greater' }).spec)],
  ['power at n = 40 pairs', () => powerAtSize(resolveInputs({ design: 'paired', effectSize: 0.4, n: 40 }).spec, 40)],
  ['smallest detectable difference, 30 per group', () => detectableDifference(resolveInputs({ design: 'independent', sd: 2, n: 30 }).spec, 30)],
  ['equivalence n, paired, margin 0.6 SD', () => sampleSize(resolveInputs({ design: 'paired', sdDiff: 1, difference: 0.1, margin: 0.6 }).spec)],
  ['equivalence n, two groups, margin 0.05 SD (about 10,000 per group)', () => sampleSize(resolveInputs({ design: 'independent', sd: 1, difference: 0.01, margin: 0.05 }).spec)],
  ['whole report: n + pairing table (6 solves) + curve', () => planSize(resolveInputs({ design: 'paired', difference: 2.5, sd: 4, rho: 0.5 }))],
];
const kernels = [
  ['noncentral t, one tail (df 30, ncp 3)', () => noncentralTSf(2.04, 30, 3)],
  ['noncentral t, far tail (df 20, ncp 6)', () => noncentralTCdf(-2.1, 20, 6)],
  ['noncentral t, ncp 40, df 10,000', () => noncentralTSf(38, 10000, 40)],
];

function median(xs) {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

function time(fn, rounds) {
  fn();
  const ms = [];
  for (let i = 0; i < rounds; i++) {
    const t0 = process.hrtime.bigint();
    fn();
    ms.push(Number(process.hrtime.bigint() - t0) / 1e6);
  }
  return { median: median(ms), max: Math.max(...ms) };
}

let worst = 0;
const width = Math.max(...[...cases, ...kernels].map(([l]) => l.length));
console.log(`size solves (median of ${ROUNDS}; target under ${TARGET_MS} ms each):`);
for (const [label, fn] of cases) {
  const t = time(fn, ROUNDS);
  worst = Math.max(worst, t.median);
  console.log(`  ${label.padEnd(width)}  ${t.median.toFixed(2).padStart(7)} ms  (max ${t.max.toFixed(2)} ms)`);
}
console.log('distribution kernels (median per call):');
for (const [label, fn] of kernels) {
  const t = time(() => { for (let i = 0; i < 100; i++) fn(); }, ROUNDS);
  console.log(`  ${label.padEnd(width)}  ${(t.median * 10).toFixed(1).padStart(7)} us`);
}
const ok = worst < TARGET_MS;
console.log(`slowest solve ${worst.toFixed(2)} ms: ${ok ? 'within' : 'OVER'} the ${TARGET_MS} ms target`);
process.exitCode = ok ? 0 : 1;
