/**
 * Generates the benchmark's input: an invented data-centre cooling trial in which each of
 * 1,000,000 server racks had its inlet air temperature (degrees C) logged with the aisle baffle
 * open and with it closed. Columns: rack, baffle_open_c, baffle_closed_c. About 23 MB.
 * Deterministic (a seeded generator), so every run reads the same bytes. The racks are listed in
 * order (rk0000001, rk0000002, ...) as an export usually lists them; with `shuffle` the ids come
 * in a scrambled order (the same values), which makes tandem check them with its hash table.
 *
 *   node bench/gen-paired.mjs [rows] [out.csv] [--shuffle]
 */
import { createWriteStream, mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import { fileURLToPath } from 'node:url';

/** mulberry32: a small seeded generator (Tommy Ettinger's public-domain design). */
function mulberry32(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export async function generatePaired(path, rows = 1_000_000, seed = 20240611, shuffle = false) {
  mkdirSync(dirname(path), { recursive: true });
  const rand = mulberry32(seed);
  const normal = () => {
    const u = 1 - rand();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rand());
  };
  const out = createWriteStream(path);
  const write = (s) => (out.write(s) ? Promise.resolve() : new Promise((r) => out.once('drain', r)));
  await write('rack,baffle_open_c,baffle_closed_c\n');
  let block = '';
  for (let i = 1; i <= rows; i++) {
    const rackLevel = 24 + 1.8 * normal();
    const open = rackLevel + 0.6 * normal();
    const closed = rackLevel - 0.35 + 0.6 * normal();
    // 999983 is prime and does not divide 10^k, so i -> i * 999983 mod rows is a permutation here.
    const id = shuffle ? ((i * 999983) % rows) + 1 : i;
    block += `rk${String(id).padStart(7, '0')},${open.toFixed(3)},${closed.toFixed(3)}\n`;
    if (i % 10000 === 0) {
      await write(block);
      block = '';
    }
  }
  if (block) await write(block);
  await new Promise((resolve, reject) => out.end((err) => (err ? reject(err) : resolve())));
  return path;
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const rows = Number(process.argv[2] ?? 1_000_000);
  const path = process.argv[3] ?? new URL('./out/paired-1m.csv', import.meta.url).pathname;
  await generatePaired(path, rows, undefined, process.argv.includes('--shuffle'));
  process.stdout.write(`${path}\n`);
}
