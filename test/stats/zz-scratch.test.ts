import { it } from 'vitest';
import { pairedT } from '../../src/stats/paired-t.js';
import { welchT } from '../../src/stats/welch-t.js';
import { opts } from './t-family-support.js';
it('timing', () => {
  for (const [n, eff] of [[1e6, 0.5], [1e6, 0.001], [1e6, 0.03], [1e5, 3], [50, 40], [5000, 0.5], [9000, 0.3], [20, 2]] as const) {
    let s = 12345;
    const rnd = () => { s = (s * 16807) % 2147483647; return s / 2147483647; };
    const gauss = () => Math.sqrt(-2 * Math.log(rnd())) * Math.cos(2 * Math.PI * rnd());
    const a = new Array(n), b = new Array(n);
    for (let i = 0; i < n; i++) { b[i] = 100 + 10 * gauss(); a[i] = b[i] + eff + gauss(); }
    const t0 = performance.now();
    const r = pairedT(a, b, opts());
    const t1 = performance.now();
    const w = welchT(a, b, opts());
    const t2 = performance.now();
    console.log(n, eff, 'paired ms', (t1 - t0).toFixed(1), 't', r.statistic.toFixed(2), r.effectSize!.ci, r.notes.length, 'welch ms', (t2 - t1).toFixed(1));
  }
});
