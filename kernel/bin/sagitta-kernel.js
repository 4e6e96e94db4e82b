#!/usr/bin/env node
// The kernel launcher in a checkout (kernel.json's argv when installed from one): registers tsx's
// loader and runs kernel/entry/sagitta-kernel.ts from source.
// The front end that started us, read before anything slow runs (see runKernel).
globalThis.sagittaParentPid = process.ppid;
const { register } = await import('tsx/esm/api');
register();
await import('../entry/sagitta-kernel.ts');
