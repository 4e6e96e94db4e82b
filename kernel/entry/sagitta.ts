#!/usr/bin/env node
// The `sagitta` command. Built to dist/kernel/entry/sagitta.js for the installed package (plain
// Node); in a checkout kernel/bin/sagitta.js registers tsx and loads this file from source.
const { main } = await import('../cli/main.js');
process.exitCode = await main(process.argv);
