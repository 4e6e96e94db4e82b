/**
 * A named model shape for fits: a function of x with named parameters, read from a parameter
 * vector starting at index `at` (so shapes can be summed without copying). Shapes used in
 * histogram fits are densities in entries per unit x; `integral`, when given, is the exact
 * ∫ₐᵇ value dx that binned fits then use instead of numerical quadrature.
 */
export interface Shape {
  readonly name: string;
  readonly parameters: readonly string[];
  value(x: number, p: ArrayLike<number>, at?: number): number;
  integral?(a: number, b: number, p: ArrayLike<number>, at?: number): number;
}

/** A model given as a plain function of x and the parameter vector. */
export type ModelFunction = (x: number, p: Float64Array) => number;

/** What the fitting layer accepts as a model: a Shape or a plain function. */
export type Model = Shape | ModelFunction;

/** True for a Shape (an object with `value` and `parameters`), false for a plain function. */
export function isShape(model: Model): model is Shape {
  return typeof model === 'object' && model !== null && typeof (model as Shape).value === 'function' && Array.isArray((model as Shape).parameters);
}

/**
 * Any user function as a Shape with named parameters (optionally with its exact integral).
 * @example customShape('power law', ['norm', 'index'], (x, p, at = 0) => p[at] * Math.pow(x, -p[at + 1]))
 */
export function customShape(
  name: string,
  parameters: readonly string[],
  value: (x: number, p: ArrayLike<number>, at?: number) => number,
  integral?: (a: number, b: number, p: ArrayLike<number>, at?: number) => number,
): Shape {
  return Object.freeze({ name, parameters: Object.freeze([...parameters]), value, ...(integral ? { integral } : {}) });
}
