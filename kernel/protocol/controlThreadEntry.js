// Worker-thread entry for controlThread.ts: a worker has its own module loader, so it registers
// tsx itself before loading the TypeScript source (as bin/sagitta-kernel.js does for the process).
import { register } from 'tsx/esm/api';

register();
await import('./controlThread.ts');
