import { it } from 'vitest';
import { run } from '../../src/cli/run.js';
import { memoryIO } from '../helpers/io.js';

it('scratch', async () => {
  const io = memoryIO({ cwd: process.env.CWD ?? '/tmp/aud', env: { TANDEM_DEBUG: '1' } });
  const code = await run((process.env.CMD ?? 'audit').split(' ').concat((process.env.ARGS ?? 'bakery.yaml').split(' ')), io);
  console.log(io.out() + '\n---stderr---\n' + io.err() + '\nexit ' + code);
});
