import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';

let plotly: string | undefined;

/** The minified plotly.js bundle from node_modules, read once per process. */
export function plotlySource(): string {
  if (plotly === undefined) {
    const require = createRequire(import.meta.url);
    plotly = readFileSync(require.resolve('plotly.js-dist-min/plotly.min.js'), 'utf8');
  }
  return plotly;
}
