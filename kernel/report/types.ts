import type { ProvenanceSnapshot } from '../../lib/provenance.js';
import type { Notebook } from '../notebook/types.js';

/** Everything a report shows besides the cells themselves. */
export interface ReportRun {
  /** Where the notebook came from (path as given on the command line) and its bytes' hash. */
  readonly source: { readonly path: string; readonly sha256: string; readonly sizeBytes: number };
  /** ISO-8601 start of the run. */
  readonly startedAt: string;
  readonly wallMs: number;
  /** 'complete' when every code cell ran without error. */
  readonly status: 'complete' | 'stopped' | 'errors';
  /** One line saying why the run did not complete. */
  readonly reason?: string;
  /** The values given with --set, as injected. */
  readonly parameters: Readonly<Record<string, unknown>>;
  readonly provenance: ProvenanceSnapshot;
  readonly versions: { readonly sagitta: string; readonly node: string; readonly typescript: string };
}

export interface ReportInput {
  /** The executed notebook (nbformat 4.5, with Sagitta's per-cell metadata). */
  readonly notebook: Notebook;
  readonly run: ReportRun;
  /** Title; default the notebook's first level-1 heading, else the file name. */
  readonly title?: string;
  /** Folder that relative image paths in markdown cells are read from; default the notebook's folder. */
  readonly imageDir?: string;
  /** Show code cells expanded (true, default) or collapsed. */
  readonly codeOpen?: boolean;
}
