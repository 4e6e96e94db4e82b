#!/usr/bin/env node
// The kernel a notebook front end starts (kernel.json's argv): `sagitta-kernel <connection-file>`.
// Built to dist/kernel/entry/sagitta-kernel.js; in a checkout kernel/bin/sagitta-kernel.js
// registers tsx and loads this file from source.

// The front end that started us, read before anything slow runs (see runKernel). The checkout's
// launcher reads it even earlier, before registering the loader, and leaves it here.
const launcher = globalThis as { sagittaParentPid?: number };
const parentPid = launcher.sagittaParentPid ?? process.ppid;

const connectionFile = process.argv[2];
if (!connectionFile) {
  process.stderr.write('usage: sagitta-kernel <connection-file>\n');
  process.exit(2);
}
const { runKernel } = await import('../protocol/main.js');
const code = await runKernel(connectionFile, parentPid);
// Cells may leave timers or handles behind; a shut-down kernel must not linger because of them.
process.exit(code);
