// Worker-thread entry of the batch path: a worker has its own module loader, so it registers tsx
// itself before loading the TypeScript source (as bin/sagitta.js does for the process).
import { register } from 'tsx/esm/api';

register();
await import('./batchWorker.ts');
