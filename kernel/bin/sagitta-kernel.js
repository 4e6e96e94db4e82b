#!/usr/bin/env node
// The kernel a notebook front end starts (kernel.json's argv): `sagitta-kernel <connection-file>`.
// Like bin/sagitta.js it registers tsx's loader, so the TypeScript sources run without a build.
import { register } from 'tsx/esm/api';

// The front end that started us, read before anything slow runs (see runKernel).
const parentPid = process.ppid;

const connectionFile = process.argv[2];
if (!connectionFile) {
  process.stderr.write('usage: sagitta-kernel <connection-file>\n');
  process.exit(2);
}
register();
const { runKernel } = await import('../protocol/main.ts');
const code = await runKernel(connectionFile, parentPid);
// Cells may leave timers or handles behind; a shut-down kernel must not linger because of them.
process.exit(code);
