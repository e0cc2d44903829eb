import { it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { parse } from 'yaml';
import { run } from '../../src/cli/run.js';
import { memoryIO } from '../helpers/io.js';
it('all', async () => {
  const dir = '/work/main/cases/audit';
  for (const f of readdirSync(dir).filter((x) => x.endsWith('.yaml')).sort()) {
    const ex = (parse(readFileSync(`${dir}/${f}`, 'utf8')) as any).expect ?? {};
    const io = memoryIO({ cwd: dir });
    const code = await run(['audit', f, '--json', ...(ex.data ? ['--data', ex.data] : [])], io);
    const j = JSON.parse(io.out());
    console.log(`${f} exit ${code} design=${j.design?.kind} rec=${j.recommended?.procedure} :: ${j.findings.map((x: any) => `${x.severity[0]}:${x.code}`).join(' ')}`);
  }
});
