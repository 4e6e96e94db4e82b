import type { Command } from 'commander';
import { msg } from '../../../lib/internal.js';
import { resultFormatOf } from '../../batch/inputFormat.js';
import { mergeParts } from '../../batch/mergeParts.js';
import { planOutputs } from '../../batch/outputPlan.js';
import { OutputSet } from '../../batch/outputSet.js';
import { checkReadable } from '../../batch/runBatch.js';
import { usage } from '../usage.js';

export const MERGE_EXAMPLES = [
  'sagitta merge out/part-1.csv out/part-2.csv out/part-3.csv out/part-4.csv --out out/tracks.csv',
];

/**
 * `sagitta merge <parts…> --out <file>`: combines the results of `sagitta fit --shard K/N` runs
 * into exactly the file one unsharded run writes (same bytes), e.g. after a job array on a
 * cluster batch scheduler.
 */
export function registerMerge(program: Command): void {
  program
    .command('merge')
    .description('combine the parts of a sharded run (sagitta fit --shard K/N) into the file one run would write')
    .argument('<parts...>', 'result files of the shards, all .csv, all .jsonl, all .json or all .parquet')
    .requiredOption('-o, --out <file>', 'merged result file, same format as the parts')
    .addHelpText('after', `
Each part's rows start with first_hit_position (where the track's first hit is in the input);
rows are put back in input order by it and the column is removed, so the merged file is byte for
byte what "sagitta fit" writes without --shard. JSON parts must be the N shards of one run (their
meta blocks are compared, and their counts added exactly).

Example (from the package folder, after the shard runs of "sagitta fit --help"):
${MERGE_EXAMPLES.map((e) => `  ${e}`).join('\n')}`)
    .action(async (parts: string[], options: { out: string }) => {
      const { format, outputs } = usage(() => {
        const f = resultFormatOf(options.out);
        for (const p of parts) {
          if (resultFormatOf(p) !== f) throw msg.badArgument('<parts>', p, `parts in the format of --out (${f})`);
        }
        return { format: f, outputs: planOutputs(parts.map((p, i) => ({ flag: `part ${i + 1}`, path: p })), [{ flag: '--out', path: options.out }]) };
      });
      for (const p of parts) checkReadable(p);
      const files = new OutputSet(outputs);
      try {
        const totals = await mergeParts(parts, format, (bytes) => files.write('--out', bytes));
        files.commit();
        process.stderr.write(`sagitta merge: ${totals.rows} rows from ${totals.parts} parts → ${options.out}\n`);
      } catch (err) {
        files.abandon();
        throw err;
      }
    });
}
