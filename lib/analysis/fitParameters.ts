import { msg } from '../errors.js';
import { isShape, type Model } from './shapes/shape.js';

/** Starting values: an array in the model's parameter order, or values by name. */
export type ParameterStart = readonly number[] | Readonly<Record<string, number>>;

/** Options every fit takes about its parameters. */
export interface ParameterOptions {
  /** Parameter names, when `start` is an array and the model a plain function (default p0, p1, …). */
  readonly names?: readonly string[];
  /** Parameters held at their starting value (names or indices). */
  readonly fixed?: readonly (string | number)[];
  /** [low, high] bounds by name (either side may be ±Infinity). */
  readonly bounds?: Readonly<Record<string, readonly [number, number]>>;
}

/** Parameters resolved for a fit: the full vector and which entries are free. */
export interface ResolvedParameters {
  readonly names: readonly string[];
  /** Starting values of all parameters, in model order. */
  readonly start: Float64Array;
  /** Indices of the free parameters. */
  readonly free: Int32Array;
  /** Bounds of the free parameters. */
  readonly lower: Float64Array;
  readonly upper: Float64Array;
}

/** Validates start, names, fixed and bounds against the model; throws a bad-call error naming the culprit. */
export function resolveParameters(model: Model, start: ParameterStart, options: ParameterOptions): ResolvedParameters {
  const shapeNames = isShape(model) ? model.parameters : undefined;
  let names: readonly string[];
  let values: number[];
  if (Array.isArray(start)) {
    values = [...(start as readonly number[])];
    names = shapeNames ?? options.names ?? values.map((_, i) => `p${i}`);
    if (names.length !== values.length) throw msg.badArgument('start', start, `${names.length} starting values, one for each of ${names.join(', ')}`);
  } else {
    const record = start as Readonly<Record<string, number>>;
    names = shapeNames ?? options.names ?? Object.keys(record);
    const unknown = Object.keys(record).filter((k) => !names.includes(k));
    if (unknown.length > 0) throw msg.badArgument('start', record, `values for the model's parameters ${names.join(', ')} (unknown: ${unknown.join(', ')})`);
    const missing = names.filter((n) => !(n in record));
    if (missing.length > 0) throw msg.badArgument('start', record, `a starting value for every parameter (missing: ${missing.join(', ')})`);
    values = names.map((n) => record[n]);
  }
  values.forEach((v, i) => { if (!Number.isFinite(v)) throw msg.badArgument(`start value of ${names[i]}`, v, 'a finite number'); });
  const fixed = new Set<number>();
  for (const f of options.fixed ?? []) {
    const i = typeof f === 'number' ? f : names.indexOf(f);
    if (!(i >= 0 && i < names.length) || !Number.isInteger(i)) throw msg.badArgument('fixed', f, `a parameter name or index of ${names.join(', ')}`);
    fixed.add(i);
  }
  const lowerAll = new Float64Array(names.length).fill(-Infinity), upperAll = new Float64Array(names.length).fill(Infinity);
  for (const [name, range] of Object.entries(options.bounds ?? {})) {
    const i = names.indexOf(name);
    if (i < 0) throw msg.badArgument('bounds', name, `a parameter name of ${names.join(', ')}`);
    const [lo, hi] = range;
    if (!(lo <= hi) || Number.isNaN(lo) || Number.isNaN(hi)) throw msg.badArgument(`bounds of ${name}`, range, '[low, high] with low ≤ high');
    if (!(values[i] >= lo && values[i] <= hi)) throw msg.badArgument(`start value of ${name}`, values[i], `a value inside its bounds [${lo}, ${hi}]`);
    lowerAll[i] = lo; upperAll[i] = hi;
  }
  const free = Int32Array.from(names.map((_, i) => i).filter((i) => !fixed.has(i)));
  return {
    names: Object.freeze([...names]),
    start: Float64Array.from(values),
    free,
    lower: Float64Array.from(free, (i) => lowerAll[i]),
    upper: Float64Array.from(free, (i) => upperAll[i]),
  };
}

/** A function of x and the full parameter vector, from either kind of model. */
export function modelEvaluator(model: Model): (x: number, p: Float64Array) => number {
  return isShape(model) ? (x, p) => model.value(x, p, 0) : model;
}
