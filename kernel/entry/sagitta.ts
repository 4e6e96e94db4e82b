#!/usr/bin/env node
// The `sagitta` command. Built to dist/kernel/entry/sagitta.js for the installed package (plain
// Node); in a checkout kernel/bin/sagitta.js registers tsx and loads this file from source.
// Worker threads of a large `fit` / `vertices` run start loading now, beside this thread; any
// the command did not take (it stopped early, or needed fewer) are stopped at the end.
// Likewise the notebook process of `sagitta run` (kernel/runner/earlyNotebookProcess.ts).
const [early, earlyNotebook] = await Promise.all([import('../batch/earlyWorkers.js'), import('../runner/earlyNotebookProcess.js')]);
earlyNotebook.startEarlyNotebookProcess(process.argv);
early.startEarlyWorkers(process.argv);
const { main } = await import('../cli/main.js');
process.exitCode = await main(process.argv);
earlyNotebook.stopEarlyNotebookProcess();
await early.stopEarlyWorkers();
