import { readFileSync } from 'node:fs';
import { join } from 'node:path';

/** One NIST StRD regression problem as stored in test/fixtures/nist-strd (see its README). */
export interface NistProblem {
  readonly dataset: string;
  readonly procedure: 'linear' | 'nonlinear';
  readonly level: 'lower' | 'average' | 'higher';
  readonly model: string;
  readonly start1?: readonly number[];
  readonly start2?: readonly number[];
  readonly certified: readonly number[];
  readonly standardDeviation: readonly number[];
  readonly residualSumOfSquares?: number;
  readonly residualStandardDeviation: number;
  readonly columns: readonly string[];
  readonly data: readonly (readonly number[])[];
}

const FIXTURES = join(import.meta.dirname, '..', 'fixtures', 'nist-strd');

export function nistProblem(name: string): NistProblem {
  return JSON.parse(readFileSync(join(FIXTURES, `${name}.json`), 'utf8')) as NistProblem;
}

/** Column `name` of a problem's data. */
export function nistColumn(p: NistProblem, name: string): Float64Array {
  const c = p.columns.indexOf(name);
  return Float64Array.from(p.data, (row) => row[c]);
}
