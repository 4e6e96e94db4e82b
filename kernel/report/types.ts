import type { Notebook } from '../notebook/types.js';
import type { RunRecord } from '../runner/runRecord.js';


export interface ReportInput {
  /** The executed notebook (nbformat 4.5, with Sagitta's per-cell metadata). */
  readonly notebook: Notebook;
  readonly run: RunRecord;
  /** Title; default the notebook's first level-1 heading, else the file name. */
  readonly title?: string;
  /** Folder that relative image paths in markdown cells are read from; default the notebook's folder. */
  readonly imageDir?: string;
  /** Show code cells expanded (true, default) or collapsed. */
  readonly codeOpen?: boolean;
}
