#!/usr/bin/env node
// The `sagitta` command (package.json "bin"). In a checkout it registers tsx's loader and runs the
// TypeScript sources, so there is no build step between a clone and a working command; in an
// installed package, which ships no sources, it runs the build (dist/kernel/entry/sagitta.js) on
// plain Node.
import { existsSync } from 'node:fs';

const source = new URL('../entry/sagitta.ts', import.meta.url);
if (existsSync(source)) {
  const { register } = await import('tsx/esm/api');
  register();
  await import(source.href);
} else {
  await import(new URL('../../dist/kernel/entry/sagitta.js', import.meta.url).href);
}
