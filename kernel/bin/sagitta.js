#!/usr/bin/env node
// Entry point of the `sagitta` command. Sagitta ships TypeScript sources and runs them through
// tsx's loader, so there is no build step between a clone and a working command.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../cli/main.ts');
process.exitCode = await main(process.argv);
