// Worker-thread entry of the ahead check (compileAhead.ts): a worker has its own module loader, so
// it registers tsx itself before loading the TypeScript source (as bin/sagitta.js does for the process).
import { register } from 'tsx/esm/api';

register();
await import('./compileAheadWorker.ts');
