import { createRequire } from 'node:module';
import type { MathJsInstance, Unit } from 'mathjs';
import { msg, type SourceLocation } from './errors.js';

/**
 * Quantities at the boundary (STYLE.md §4). Text like "1.5 T", "15 kG", "300 um", "100 MeV" or
 * "2.1 GeV/c" is parsed once by mathjs and converted to Sagitta's internal units:
 *
 * | dimension | internal unit |
 * |-----------|---------------|
 * | field     | tesla         |
 * | length    | metre         |
 * | energy    | MeV           |
 * | momentum  | GeV/c         |
 * | voltage   | volt          |
 * | current   | ampere        |
 * | angle     | radian        |
 * | areal density (mass thickness) | g/cm²  |
 *
 * mathjs has no gauss; it is added here (1 G = 1e-4 T, with SI prefixes so "kG" works), because
 * older chamber logbooks give fields in kilogauss.
 *
 * mathjs takes about a second to load, which a command-line fit of a few seconds cannot afford.
 * So the common form "<number> <unit>" with a unit from the small table below is read directly,
 * and mathjs is loaded only for anything else (expressions, other units, error messages). The
 * table's factors are checked against mathjs in test/units.test.ts.
 */
let mathInstance: MathJsInstance | undefined;
function mathjs(): MathJsInstance {
  if (mathInstance === undefined) {
    const { create, all } = createRequire(import.meta.url)('mathjs') as typeof import('mathjs');
    mathInstance = create(all, {});
    mathInstance.createUnit('gauss', { definition: '1e-4 T', prefixes: 'short', aliases: ['G', 'Gs'] }, { override: false });
  }
  return mathInstance;
}

/** Factor to each dimension's internal unit for the units read without mathjs. */
export const DIRECT_UNITS: Readonly<Record<Dimension, Readonly<Record<string, number>>>> = Object.freeze({
  field: { T: 1, mT: 1e-3, uT: 1e-6, G: 1e-4, gauss: 1e-4, kG: 0.1, kgauss: 0.1 },
  length: { m: 1, cm: 1e-2, mm: 1e-3, um: 1e-6, nm: 1e-9, km: 1e3 },
  energy: { eV: 1e-6, keV: 1e-3, MeV: 1, GeV: 1e3, TeV: 1e6 },
  momentum: { eV: 1e-9, keV: 1e-6, MeV: 1e-3, GeV: 1, TeV: 1e3 },
  voltage: { V: 1, mV: 1e-3, kV: 1e3 },
  current: { A: 1, mA: 1e-3, kA: 1e3 },
  angle: { rad: 1, mrad: 1e-3, urad: 1e-6, deg: Math.PI / 180, degree: Math.PI / 180 },
  arealDensity: { 'g/cm2': 1, 'mg/cm2': 1e-3, 'ug/cm2': 1e-6, 'kg/m2': 0.1, 'g/m2': 1e-4 },
});
const DIRECT = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*([A-Za-zµμ°][A-Za-z0-9µμ/]*)$/;

export type Dimension = 'field' | 'length' | 'energy' | 'momentum' | 'voltage' | 'current' | 'angle' | 'arealDensity';

interface DimensionSpec {
  readonly base: string;
  readonly internal: string;
  readonly label: string;
  readonly example: string;
}

const SPECS: Readonly<Record<Dimension, DimensionSpec>> = Object.freeze({
  field: { base: 'MAGNETIC_FLUX_DENSITY', internal: 'T', label: 'a magnetic field', example: '1.5 T' },
  length: { base: 'LENGTH', internal: 'm', label: 'a length', example: '2.5 mm' },
  energy: { base: 'ENERGY', internal: 'MeV', label: 'an energy', example: '100 MeV' },
  // Momenta are written in energy units over c; "/c" is stripped before parsing.
  momentum: { base: 'ENERGY', internal: 'GeV', label: 'a momentum', example: '2.1 GeV/c' },
  voltage: { base: 'ELECTRIC_POTENTIAL', internal: 'V', label: 'a voltage', example: '250 V' },
  current: { base: 'CURRENT', internal: 'A', label: 'a current', example: '1.2 A' },
  angle: { base: 'ANGLE', internal: 'rad', label: 'an angle', example: '3 mrad' },
  // mathjs reads "g/cm^2"; "g/cm2" and "g/cm²" are normalised to it first.
  arealDensity: { base: 'SURFACE_DENSITY', internal: 'g/cm^2', label: 'an areal density', example: '7 g/cm2' },
});

export interface QuantityOptions {
  /** Unit assumed when the text is a bare number, e.g. 'mm'. Without it a bare number is an error. */
  readonly defaultUnit?: string;
  /** What is being read, for messages ("--field", "column x"). */
  readonly what?: string;
  readonly where?: SourceLocation;
}

const BARE_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Parses text with a unit into the internal unit of `dimension` (table above).
 * Throws BAD_QUANTITY, MISSING_UNIT or WRONG_DIMENSION with the text and an example.
 * @example quantity('15 kG', 'field') // 1.5 (tesla)
 */
export function quantity(text: string, dimension: Dimension, options: QuantityOptions = {}): number {
  const spec = SPECS[dimension];
  const what = options.what ?? spec.label;
  const where = options.where ?? {};
  let s = String(text).trim();
  if (dimension === 'momentum') s = s.replace(/\s*\/\s*c\s*$/i, '');
  // Mass thickness is written "g/cm2", "g/cm^2" or "g/cm²"; the direct table spells it the first way.
  if (dimension === 'arealDensity') s = s.replace(/\s*\/\s*/g, '/').replace(/(cm|m)(?:\^2|²)(?=\)?$)/, (_, l: string) => `${l}2`);
  if (s === '') throw msg.badQuantity(text, what, spec.example, where);
  if (BARE_NUMBER.test(s)) {
    if (options.defaultUnit === undefined) throw msg.missingUnit(text, what, spec.example, where);
    s = `${s} ${options.defaultUnit}`;
  }
  const direct = DIRECT.exec(s);
  if (direct) {
    const factor = DIRECT_UNITS[dimension][direct[2].replace(/^[µμ]/, 'u')];
    if (factor !== undefined) {
      const value = Number(direct[1]) * factor;
      if (!Number.isFinite(value)) throw msg.badQuantity(text, what, spec.example, where);
      return value;
    }
  }
  // mathjs multiplies side by side ("1.5 T 2" would be 3 T): a number after a unit word is refused.
  if (UNIT_THEN_NUMBER.test(s)) throw msg.badQuantity(text, what, spec.example, where);
  const math = mathjs();
  let u: Unit;
  try {
    const parsed: unknown = math.evaluate(dimension === 'arealDensity' ? s.replace(/(cm|m)2(?=\)?$)/, (_, l: string) => `${l}^2`) : s);
    if (!math.isUnit(parsed)) throw new Error('not a unit');
    u = parsed;
  } catch {
    throw msg.badQuantity(text, what, spec.example, where);
  }
  if (!u.equalBase(math.unit(spec.internal))) throw msg.wrongDimension(text, what, spec.label, spec.example, where);
  let value: unknown;
  try {
    value = u.toNumber(spec.internal);
  } catch {
    // A complex value ("sqrt(-1) T") or another non-real quantity.
    throw msg.badQuantity(text, what, spec.example, where);
  }
  if (typeof value !== 'number' || !Number.isFinite(value)) throw msg.badQuantity(text, what, spec.example, where);
  return value;
}

/** A unit word followed by a space and a number, as in "1.5 T 2" (not an exponent: "1e3 T" has no space). */
const UNIT_THEN_NUMBER = /[a-zA-Zµμ°Ω]\s+[+-]?[\d.]/;

/** "1.5 T" | "15 kG" | "1500 mT" → tesla. */
export const fieldTesla = (text: string, options?: QuantityOptions): number => quantity(text, 'field', options);
/** "2.5 mm" | "300 um" → metres. */
export const lengthMetres = (text: string, options?: QuantityOptions): number => quantity(text, 'length', options);
/** "100 MeV" | "2 GeV" → MeV. */
export const energyMeV = (text: string, options?: QuantityOptions): number => quantity(text, 'energy', options);
/** "2.1 GeV/c" | "350 MeV/c" → GeV/c. */
export const momentumGeV = (text: string, options?: QuantityOptions): number => quantity(text, 'momentum', options);
/** "3 mrad" | "0.5 deg" → radians. */
export const angleRad = (text: string, options?: QuantityOptions): number => quantity(text, 'angle', options);
/** "7 g/cm2" | "7 g/cm^2" | "70 kg/m2" → g/cm². */
export const arealDensityGcm2 = (text: string, options?: QuantityOptions): number => quantity(text, 'arealDensity', options);

/**
 * Metres per unit for a length unit name as written in a table header ("mm", "cm", "um", "µm",
 * "m", "in"). Throws UNKNOWN_UNIT for anything that is not a length.
 * @example metresPerUnit('cm') // 0.01
 */
export function metresPerUnit(unit: string, where: SourceLocation = {}): number {
  // Named by a command-line flag ("--length-unit") rather than a table column: say it as a flag.
  if (typeof where.column === 'string' && where.column.startsWith('--')) {
    try {
      return metresPerUnit(unit);
    } catch {
      throw msg.badArgument(where.column, unit, 'a length unit such as um, mm, cm or m');
    }
  }
  const name = unit.trim().replace(/^µ|^μ/, 'u');
  const direct = DIRECT_UNITS.length[name];
  if (direct !== undefined) return direct;
  const math = mathjs();
  let u: Unit;
  try {
    u = math.unit(1, name);
  } catch {
    throw msg.unknownUnit(unit, 'a length', 'um, mm, cm, m', where);
  }
  if (!u.equalBase(math.unit('m'))) throw msg.unknownUnit(unit, 'a length', 'um, mm, cm, m', where);
  return u.toNumber('m');
}

/**
 * A point in space [m] from text: three numbers and one length unit ("-55 0 0 cm", "0,0,0 m"),
 * or three lengths each with its unit ("-55 cm 2 mm 0 m"). A bare number without a unit is
 * refused (MISSING_UNIT), as everywhere else.
 * @example pointMetres('-55 0 10 cm') // [-0.55, 0, 0.1]
 */
export function pointMetres(text: string, options: QuantityOptions = {}): [number, number, number] {
  const what = options.what ?? 'a point';
  const parts = String(text).trim().split(/[\s,;]+/).filter((p) => p !== '');
  const number = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
  if (parts.length === 4 && parts.slice(0, 3).every((p) => number.test(p))) {
    const f = metresPerUnit(parts[3]);
    return [Number(parts[0]) * f, Number(parts[1]) * f, Number(parts[2]) * f];
  }
  if (parts.length === 6) return [0, 1, 2].map((k) => lengthMetres(`${parts[2 * k]} ${parts[2 * k + 1]}`, { ...options, what })) as [number, number, number];
  // "1 2 cm": a unit after fewer than three numbers.
  if (parts.length >= 2 && parts.length <= 3 && !number.test(parts[parts.length - 1]) && parts.slice(0, -1).every((p) => number.test(p))) {
    throw msg.badQuantity(text, `${what} (three coordinates and a unit)`, '-55 0 0 cm', options.where ?? {});
  }
  if (parts.length === 3 && !parts.every((p) => number.test(p))) return parts.map((p) => lengthMetres(p, { ...options, what })) as [number, number, number];
  if (parts.length === 3) throw msg.missingUnit(text, what, '-55 0 0 cm', options.where ?? {});
  throw msg.badQuantity(text, what, '-55 0 0 cm', options.where ?? {});
}
