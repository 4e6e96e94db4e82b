import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { type InputRecord } from '../../lib/index.js';
import type { InputFile } from './runRecord.js';

interface RunRecordFile {
  format?: unknown;
  simulated?: unknown;
  seed?: unknown;
  scenario?: unknown;
  files?: Record<string, unknown>;
}

/**
 * The data files a run read, by path relative to the notebook, each marked simulated when a
 * simulator run record (`*.run.json`, format "sagitta-run/…") beside it names it among the files
 * it made — with that record's seed and scenario, so the report can give the seed of simulated
 * inputs even when the notebook never ran the simulator itself.
 */
export function describeInputs(inputs: readonly InputRecord[], notebookDir: string): InputFile[] {
  const records = new Map<string, Array<{ file: string; record: RunRecordFile }>>();
  const recordsIn = (dir: string) => {
    let found = records.get(dir);
    if (found) return found;
    found = [];
    if (existsSync(dir)) {
      for (const name of readdirSync(dir).filter((n) => n.endsWith('.run.json'))) {
        try {
          const record = JSON.parse(readFileSync(path.join(dir, name), 'utf8')) as RunRecordFile;
          if (typeof record.format === 'string' && record.format.startsWith('sagitta-run/')) found.push({ file: path.join(dir, name), record });
        } catch {
          // not a run record
        }
      }
    }
    records.set(dir, found);
    return found;
  };
  return inputs.map((f) => {
    const rel = path.relative(notebookDir, f.path).replace(/\\/g, '/');
    const base: InputFile = { path: rel, sizeBytes: f.sizeBytes, sha256: f.sha256 };
    const maker = recordsIn(path.dirname(f.path)).find(({ record }) => Object.values(record.files ?? {}).includes(path.basename(f.path)));
    if (!maker || maker.record.simulated === false) return base;
    const seed = typeof maker.record.seed === 'number' || typeof maker.record.seed === 'string' ? maker.record.seed : undefined;
    return {
      ...base,
      simulated: {
        runRecord: path.relative(notebookDir, maker.file).replace(/\\/g, '/'),
        ...(seed !== undefined ? { seed } : {}),
        ...(typeof maker.record.scenario === 'string' ? { scenario: maker.record.scenario } : {}),
      },
    };
  });
}
