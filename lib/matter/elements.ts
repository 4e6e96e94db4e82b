import { msg } from '../errors.js';
import { radiationLengthTsai } from './radiationLength.js';

/**
 * Elements used to build compounds and mixtures.
 *
 * Sources: atomic masses and mean excitation energies I as carried in the PDG "Atomic and
 * Nuclear Properties of Materials" tables (I values from ICRU Report 37 (1984) / ICRU 49 for
 * the elements shown; values recalled from those tables, marked (memory) until a fixture is
 * read from the publication). Radiation lengths are not typed in: they are computed with Tsai's
 * formula (`radiationLengthTsai`), which is how the PDG tables obtain theirs; the test compares
 * them with the PDG values.
 */
export interface Element {
  readonly symbol: string;
  readonly atomicNumber: number;
  /** Standard atomic weight [g/mol]. */
  readonly atomicMassGmol: number;
  /** Mean excitation energy of the element [eV] (memory of PDG/ICRU 37 tables). */
  readonly meanExcitationEV: number;
  /** Radiation length [g/cm²], Tsai's formula. */
  readonly radiationLengthGcm2: number;
}

const E = (symbol: string, atomicNumber: number, atomicMassGmol: number, meanExcitationEV: number): Element =>
  Object.freeze({ symbol, atomicNumber, atomicMassGmol, meanExcitationEV, radiationLengthGcm2: radiationLengthTsai(atomicNumber, atomicMassGmol) });

export const ELEMENTS: Readonly<Record<string, Element>> = Object.freeze({
  H: E('H', 1, 1.00794, 19.2),
  He: E('He', 2, 4.002602, 41.8),
  C: E('C', 6, 12.0107, 78.0),
  N: E('N', 7, 14.0067, 82.0),
  O: E('O', 8, 15.9994, 95.0),
  F: E('F', 9, 18.9984032, 115.0),
  Ne: E('Ne', 10, 20.1797, 137.0),
  Na: E('Na', 11, 22.98976928, 149.0),
  Al: E('Al', 13, 26.9815386, 166.0),
  Si: E('Si', 14, 28.0855, 173.0),
  S: E('S', 16, 32.065, 180.0),
  Cl: E('Cl', 17, 35.453, 174.0),
  Ar: E('Ar', 18, 39.948, 188.0),
  Ca: E('Ca', 20, 40.078, 191.0),
  Fe: E('Fe', 26, 55.845, 286.0),
  Cu: E('Cu', 29, 63.546, 322.0),
  Br: E('Br', 35, 79.904, 343.0),
  Ag: E('Ag', 47, 107.8682, 470.0),
  I: E('I', 53, 126.90447, 491.0),
  Xe: E('Xe', 54, 131.293, 482.0),
  W: E('W', 74, 183.84, 727.0),
  Pb: E('Pb', 82, 207.2, 823.0),
});

/** Looks an element up by its symbol (case as written: "Si", "Ag"). Throws BAD_ARGUMENT. */
export function element(symbol: string): Element {
  const e = ELEMENTS[symbol];
  if (!e) throw msg.badArgument('element', symbol, `one of ${Object.keys(ELEMENTS).join(', ')}`);
  return e;
}
