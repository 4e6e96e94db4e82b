#!/usr/bin/env node
// The `sagitta` command in a checkout: registers tsx's loader and runs the TypeScript sources, so
// there is no build step between a clone and a working command. The installed package runs its
// build instead (package.json "bin": dist/kernel/entry/sagitta.js).
import { register } from 'tsx/esm/api';

register();
await import('../entry/sagitta.ts');
