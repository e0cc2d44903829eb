import { it } from 'vitest';
import { run } from '../../src/cli/run.js';
import { memoryIO } from '../helpers/io.js';

it('scratch', async () => {
  const io = memoryIO({ cwd: '/tmp/aud' });
  const code = await run(['audit', ...(process.env.ARGS ?? 'bakery.yaml').split(' ')], io);
  console.log(io.out() + '\n---stderr---\n' + io.err() + '\nexit ' + code);
});
