import { msg } from '../errors.js';
import type { FitMethod } from './fitMethod.js';
import { GEOMETRIC_METHOD } from './geometricCircle.js';
import { KASA_METHOD } from './kasaCircle.js';
import { TAUBIN_METHOD } from './taubinCircle.js';

/**
 * The fitter registry: every track-fit method `sagitta fit --fitter`, `measureTracks({ method })`
 * and the fit lab know, by name. A new built-in fitter is one file exporting its `FitMethod`
 * plus one line here; a method written in a notebook joins with `registerFitMethod`.
 */
const BUILT_IN: readonly FitMethod[] = [GEOMETRIC_METHOD, TAUBIN_METHOD, KASA_METHOD];

const REGISTRY = new Map<string, FitMethod>(BUILT_IN.map((m) => [m.name, m]));

/** Names of the built-in methods, in the order help texts list them (default first). */
export const BUILT_IN_FIT_METHODS: readonly string[] = Object.freeze(BUILT_IN.map((m) => m.name));

/** The method registered under `name` (a method object is returned as it is); a bad call names the known ones. */
export function fitMethod(name: string | FitMethod): FitMethod {
  if (typeof name !== 'string') return name;
  const m = REGISTRY.get(name);
  if (m === undefined) throw msg.badArgument('method', name, [...REGISTRY.keys()].join(' | '));
  return m;
}

/** Every registered method, built-ins first. */
export function fitMethods(): readonly FitMethod[] {
  return [...REGISTRY.values()];
}

/**
 * Adds a method to the registry (e.g. one written in a notebook cell with `defineFitMethod`).
 * Built-in names cannot be replaced; registering the same user name again replaces it, so a
 * re-run cell does not fail.
 * @example registerFitMethod(defineFitMethod({ name: 'three-point', fitTrack: (t) => ({ kappa: threePoint(t) }) }))
 */
export function registerFitMethod(method: FitMethod): FitMethod {
  if (!/^[a-z][a-z0-9-]*$/.test(method.name)) throw msg.badArgument('method.name', method.name, 'lower-case letters, digits and dashes, starting with a letter');
  if (BUILT_IN_FIT_METHODS.includes(method.name) && REGISTRY.get(method.name) !== method) {
    throw msg.badArgument('method.name', method.name, `a name other than the built-in ${BUILT_IN_FIT_METHODS.join(', ')}`);
  }
  REGISTRY.set(method.name, method);
  return method;
}
