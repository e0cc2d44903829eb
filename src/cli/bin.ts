#!/usr/bin/env node
import { run } from './run.js';
import { processIO } from './io.js';

process.exitCode = await run(process.argv.slice(2), processIO());
