#!/usr/bin/env node
// The kernel launcher (kernel.json's argv): in a checkout it registers tsx's loader and runs
// kernel/entry/sagitta-kernel.ts from source; in an installed package it runs the build.
// The front end that started us, read before anything slow runs (see runKernel).
globalThis.sagittaParentPid = process.ppid;
const { existsSync } = await import('node:fs');
const source = new URL('../entry/sagitta-kernel.ts', import.meta.url);
if (existsSync(source)) {
  const { register } = await import('tsx/esm/api');
  register();
  await import(source.href);
} else {
  await import(new URL('../../dist/kernel/entry/sagitta-kernel.js', import.meta.url).href);
}
