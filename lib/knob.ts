import { msg, SagittaError } from './errors.js';
import { DIRECT_UNITS, quantity, type Dimension } from './units.js';

/**
 * Notebook knobs: values a notebook declares as adjustable, with their type and unit, so that a
 * run can change them without editing the notebook.
 *
 *   const fieldT = knob('field', '1.5 T');        // a field: 1.5 (tesla) unless the run says otherwise
 *   const shownEvent = knob('shownEvent', 201);   // a plain number
 *   const window = knob('window', [0, 2]);        // a pair of numbers, kept as a pair
 *
 * `sagitta run nb.ipynb --set field="1.2 T"` supplies a value; the runner finds every `knob(…)`
 * call in the notebook before any cell runs and refuses a value of the wrong type or unit
 * (`--set field=1.2` has no unit; `--set field="2 m"` is not a field) or a name no knob declares.
 * A quantity knob returns the value in Sagitta's internal unit for its dimension (tesla, metre,
 * MeV, GeV/c, volt, ampere, radian, g/cm² — lib/units.ts), whatever unit it was written in. Without a supplied
 * value (in the live kernel, say) a knob is its default.
 *
 * Supplied values and the knobs used live on globalThis under a registered symbol, shared by
 * every copy of the library in the process (as the warnings and provenance stores are).
 */

/** The kinds of value a knob can hold, read from its default. */
export type KnobKind = 'quantity' | 'number' | 'boolean' | 'text' | 'list';

/** A knob as a run used it, for the report's provenance. */
export interface KnobRecord {
  readonly name: string;
  readonly kind: KnobKind;
  /** The default as the notebook wrote it, e.g. "1.5 T", 201, [0, 2] (JSON text). */
  readonly defaultText: string;
  /** The value used, as written (the supplied text, or the default). */
  readonly valueText: string;
  /** True when the run supplied the value. */
  readonly supplied: boolean;
  /** For quantities: the dimension and the internal unit the value is returned in. */
  readonly dimension?: Dimension;
  readonly internalUnit?: string;
}

type KnobDefault = number | string | boolean | readonly (number | string | boolean)[];

interface KnobStore {
  supplied: Map<string, string>;
  used: Map<string, KnobRecord>;
}

const STORE_KEY = Symbol.for('sagitta.knobs');
const NAME = /^[A-Za-z_][A-Za-z0-9_]*$/;
const RESERVED = new Set(['__proto__', 'constructor', 'prototype']);
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const QUANTITY = /^\s*[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*\S.*$/;
const INTERNAL_UNIT: Readonly<Record<Dimension, string>> = Object.freeze({ field: 'T', length: 'm', energy: 'MeV', momentum: 'GeV/c', voltage: 'V', current: 'A', angle: 'rad', arealDensity: 'g/cm²' });

function store(): KnobStore {
  const g = globalThis as unknown as Record<symbol, KnobStore | undefined>;
  return (g[STORE_KEY] ??= { supplied: new Map(), used: new Map() });
}

/** Quantity knob: "1.5 T" → 1.5 (tesla). */
export function knob(name: string, defaultValue: `${number} ${string}`): number;
export function knob(name: string, defaultValue: number): number;
export function knob(name: string, defaultValue: boolean): boolean;
export function knob(name: string, defaultValue: string): string;
/** List knob: the default's shape is kept ([0, 2] is a [number, number]). */
export function knob<T extends [] | (number | string | boolean)[]>(name: string, defaultValue: T): T;
/**
 * Declares a knob and returns its value for this run (the supplied one, else the default).
 * Throws BAD_KNOB for a bad name, a default of no knob kind, or the same name declared twice
 * with different defaults.
 * @example const fieldT = knob('field', '1.5 T') // 1.5, or 1.2 under `--set field="1.2 T"`
 */
export function knob(name: string, defaultValue: KnobDefault): unknown {
  checkKnobName(name);
  const kind = knobKind(name, defaultValue);
  const s = store();
  const text = s.supplied.get(name);
  const defaultText = typeof defaultValue === 'string' ? defaultValue : JSON.stringify(defaultValue);
  const earlier = s.used.get(name);
  if (earlier && earlier.defaultText !== defaultText) throw msg.badKnob(name, `declared again with default ${defaultText}; it was declared with ${earlier.defaultText}`);
  const value = text === undefined ? readKnobValue(name, defaultValue, defaultText) : readKnobValue(name, defaultValue, text);
  const dimension = kind === 'quantity' ? quantityDimension(name, defaultValue as string) : undefined;
  s.used.set(name, Object.freeze({
    name, kind, defaultText, valueText: text ?? defaultText, supplied: text !== undefined,
    ...(dimension ? { dimension, internalUnit: INTERNAL_UNIT[dimension] } : {}),
  }));
  return value;
}

/** Throws BAD_KNOB unless `name` can name a knob (an identifier-like word, not a reserved one). */
export function checkKnobName(name: string): void {
  if (typeof name !== 'string' || !NAME.test(name) || RESERVED.has(name)) {
    throw msg.badKnob(String(name), 'a knob name is a word of letters, digits and _ (not starting with a digit, and not __proto__, constructor or prototype)');
  }
}

/** The kind of knob a default makes; throws BAD_KNOB for a default no knob can have. */
export function knobKind(name: string, defaultValue: unknown): KnobKind {
  if (typeof defaultValue === 'number') {
    if (!Number.isFinite(defaultValue)) throw msg.badKnob(name, `the default ${defaultValue} is not a finite number`);
    return 'number';
  }
  if (typeof defaultValue === 'boolean') return 'boolean';
  if (typeof defaultValue === 'string') {
    if (!QUANTITY.test(defaultValue) || NUMBER.test(defaultValue.trim())) return 'text';
    quantityDimension(name, defaultValue);
    return 'quantity';
  }
  if (Array.isArray(defaultValue) && defaultValue.length > 0 && defaultValue.every((x) => ['number', 'string', 'boolean'].includes(typeof x))) return 'list';
  throw msg.badKnob(name, 'a default is a number, true/false, text, a quantity with a unit ("1.5 T") or a non-empty list of those');
}

/** The dimension of a quantity written like "1.5 T" or "350 MeV/c". */
function quantityDimension(name: string, text: string): Dimension {
  const unit = text.trim().replace(/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*/, '');
  const dims = (Object.keys(DIRECT_UNITS) as Dimension[]).filter((d) => d !== 'momentum');
  if (/\/\s*c\s*$/i.test(unit)) return 'momentum';
  const direct = dims.find((d) => DIRECT_UNITS[d][unit.replace(/^[µμ]/, 'u')] !== undefined);
  if (direct) return direct;
  for (const d of dims) {
    try {
      quantity(text, d);
      return d;
    } catch {
      // not this dimension
    }
  }
  throw msg.badKnob(name, `the default ${JSON.stringify(text)} starts with a number but "${unit}" is not a unit Sagitta knows; write a plain number, or text that does not start with one`);
}

/**
 * Reads a knob value given as text (`--set name=text`) against the knob's default: the same
 * kind, and for quantities the same dimension. Throws BAD_KNOB saying what was expected.
 * @example readKnobValue('field', '1.5 T', '12 kG') // 1.2 (tesla)
 */
export function readKnobValue(name: string, defaultValue: KnobDefault, text: string): unknown {
  const kind = knobKind(name, defaultValue);
  const bad = (expected: string) => msg.badKnob(name, `${JSON.stringify(text)} is not ${expected} (the notebook's default is ${typeof defaultValue === 'string' ? JSON.stringify(defaultValue) : JSON.stringify(defaultValue)})`);
  switch (kind) {
    case 'number':
      if (!NUMBER.test(text.trim())) throw bad('a plain number');
      return Number(text);
    case 'boolean':
      if (text !== 'true' && text !== 'false') throw bad('true or false');
      return text === 'true';
    case 'text':
      return text;
    case 'quantity': {
      const dimension = quantityDimension(name, defaultValue as string);
      try {
        return quantity(text, dimension);
      } catch (err) {
        if (err instanceof SagittaError) throw bad(`${dimension === 'field' ? 'a field' : `a ${dimension}`} with a unit, e.g. ${JSON.stringify(defaultValue)}`);
        throw err;
      }
    }
    case 'list': {
      const defaults = defaultValue as readonly (number | string | boolean)[];
      let parsed: unknown;
      try {
        parsed = JSON.parse(text);
      } catch {
        throw bad(`a list like ${JSON.stringify(defaults)}`);
      }
      if (!Array.isArray(parsed) || parsed.length !== defaults.length || parsed.some((x, i) => typeof x !== typeof defaults[i])) {
        throw bad(`a list of ${defaults.length} ${defaults.map((d) => typeof d).join(', ')} like ${JSON.stringify(defaults)}`);
      }
      return Object.freeze(parsed);
    }
  }
}

/** Sets the values a run supplies (the runner calls this before the first cell). */
export function supplyKnobs(values: ReadonlyMap<string, string>): void {
  const s = store();
  s.supplied = new Map(values);
  s.used.clear();
}

/** The knobs declared so far, in declaration order. */
export function knobSnapshot(): readonly KnobRecord[] {
  return Object.freeze([...store().used.values()]);
}
