import { describe, expect, it } from 'vitest';
import { SagittaError } from '../../lib/errors.js';
import { compound, material } from '../../lib/matter/index.js';
import { parseMaterialFile } from '../../lib/matter/materialFile.js';

const bad = (text: string) => {
  try {
    parseMaterialFile(text, 'm.txt');
  } catch (e) {
    if (e instanceof SagittaError) return `${e.code} ${e.message}`;
    throw e;
  }
  return 'no error';
};

describe('parseMaterialFile (our material-file format)', () => {
  it('a formula gives the same material as compound()', () => {
    const m = parseMaterialFile('name: propane-gas\ndensity: 1.879 kg/m3\nstate: gas\nformula: C3H8\n', 'p.txt');
    const c = compound('propane-gas', { C: 3, H: 8 }, { densityGcm3: 1.879e-3, state: 'gas' });
    expect(m.zOverA).toBeCloseTo(c.zOverA, 12);
    expect(m.meanExcitationEV).toBeCloseTo(c.meanExcitationEV, 9);
    expect(m.densityGcm3).toBeCloseTo(1.879e-3, 15);
    expect(m.state).toBe('gas');
  });
  it('parts may be elements, table materials or formulas; the Ar/CO₂ 70/30 of the table comes back', () => {
    const m = parseMaterialFile('name: my-arco2\ndensity: 1.716e-3 g/cm3\nstate: gas\npart: argon-gas 0.6793\npart: CO2 0.3207\n', 'a.txt');
    const t = material('ar-co2-70-30');
    expect(m.zOverA / t.zOverA).toBeCloseTo(1, 4);
    expect(m.meanExcitationEV / t.meanExcitationEV).toBeCloseTo(1, 2);
  });
  it('each mistake is one BAD_MATERIAL_FILE naming file:line and what to write', () => {
    expect(bad('name: X\n')).toBe('BAD_MATERIAL_FILE m.txt:1: name "X" must be lower case letters, digits and hyphens, e.g. "ar-ch4-90-10"');
    expect(bad('name: a\ndensity: 2\nformula: H2O\n')).toMatch(/^BAD_MATERIAL_FILE m\.txt:2: density must be a positive number with a unit/);
    expect(bad('name: a\ndensity: 1 g/cm3\nformula: H2Q\n')).toMatch(/^BAD_MATERIAL_FILE m\.txt:3: unknown element "Q"|cannot read the formula/);
    expect(bad('name: a\ndensity: 1 g/cm3\ncolour: red\n')).toMatch(/m\.txt:3: unknown key "colour"/);
    expect(bad('name: a\nformula: H2O\n')).toMatch(/m\.txt:3: no "density:" line/);
    expect(bad('name: a\ndensity: 1 g/cm3\nformula: H2O\npart: Ar 1\n')).toMatch(/m\.txt:4: "part:" lines and the "formula:" on line 3 exclude each other/);
    expect(bad('name: a\ndensity: 1 g/cm3\npart: Ar 0.5\npart: O 0.3\n')).toMatch(/m\.txt:3: the mass fractions of the parts sum to 0\.8, not 1/);
    expect(bad('name: a\ndensity: 1 g/cm3\npart: unobtainium 1\n')).toMatch(/m\.txt:3: "unobtainium" is neither an element symbol/);
  });

  it('reads comments, blank lines and free spacing; state, excitation and both density units', () => {
    const m = parseMaterialFile('# a comment line\nname: a-1 # trailing comment\n\n   density :   1.56 kg / m³  \nstate:liquid\nformula:C3H8\nexcitation: 60eV\n', 'f.txt');
    expect([m.name, m.state, m.densityGcm3, m.meanExcitationEV]).toEqual(['a-1', 'liquid', 1.56e-3, 60]);
    expect(parseMaterialFile('name: b\ndensity: 2 g/cm3\nformula: H2O\n', 'f.txt').state).toBe('solid');
    expect(parseMaterialFile('name: b\ndensity: 2 g/cm3\nstate: solid\nformula: H2O\n', 'f.txt').state).toBe('solid');
    expect(parseMaterialFile('name: b\ndensity: 2g / cm3\nstate: gas\nformula: H2O\n', 'f.txt')).toMatchObject({ state: 'gas', densityGcm3: 2 });
    // Without an excitation line I comes from additivity: the same as compound() gives.
    const c = compound('b', { H: 2, O: 1 }, { densityGcm3: 2 });
    expect(parseMaterialFile('name: b\ndensity: 2 g/cm3\nformula: H2O\n', 'f.txt').meanExcitationEV).toBe(c.meanExcitationEV);
    expect(parseMaterialFile('name: b\ndensity: 2 g/cm3\nformula: H2O\nexcitation: 78 eV\n', 'f.txt').meanExcitationEV).toBe(78);
  });
  it('formulas: decimal counts, repeated symbols added up, a formula as a part', () => {
    const a = parseMaterialFile('name: e\ndensity: 1 g/cm3\nformula: CH3CH3\n', 'f.txt');
    const b = compound('e', { C: 2, H: 6 }, { densityGcm3: 1 });
    expect(a.zOverA).toBe(b.zOverA);
    const d = parseMaterialFile('name: d\ndensity: 1 g/cm3\nformula: C1.25H4\n', 'f.txt');
    expect(d.zOverA).toBeCloseTo(compound('d', { C: 1.25, H: 4 }, { densityGcm3: 1 }).zOverA, 14);
    const mix = parseMaterialFile('name: arch4\ndensity: 1.6e-3 g/cm3\nstate: gas\npart: Ar  0.9\npart: CH4 0.1\n', 'f.txt');
    const ref = compound('ch4', { C: 1, H: 4 }, { densityGcm3: 1 });
    expect(mix.zOverA).toBeCloseTo(0.9 * (18 / 39.948) + 0.1 * ref.zOverA, 12);
    // Fractions within 1 % of 1 are renormalised.
    expect(parseMaterialFile('name: w\ndensity: 1 g/cm3\npart: H 0.112\npart: O 0.893\n', 'f.txt').zOverA)
      .toBeCloseTo((0.112 / 1.005) * (1 / 1.00794) + (0.893 / 1.005) * (8 / 15.9994), 12);
  });
  it('every other refusal, word for word', () => {
    const msgs: [string, string][] = [
      ['name: a\ndensity 1 g/cm3\n', 'm.txt:2: expected "key: value" (keys: name, density, state, formula, part, excitation), found "density 1 g/cm3"'],
      ['name: Xa\n', 'm.txt:1: name "Xa" must be lower case letters, digits and hyphens, e.g. "ar-ch4-90-10"'],
      ['name: a_b\n', 'm.txt:1: name "a_b" must be lower case letters, digits and hyphens, e.g. "ar-ch4-90-10"'],
      ['name: -a\n', 'm.txt:1: name "-a" must be lower case letters, digits and hyphens, e.g. "ar-ch4-90-10"'],
      ['name: a\nstate: plasma\n', 'm.txt:2: state "plasma" must be solid, liquid or gas'],
      ['name: a\ndensity: 0 g/cm3\n', 'm.txt:2: density must be a positive number with a unit, e.g. "density: 1.56e-3 g/cm3" or "1.56 kg/m3", found "0 g/cm3"'],
      ['name: a\ndensity: 1e999 g/cm3\n', 'm.txt:2: density must be a positive number with a unit, e.g. "density: 1.56e-3 g/cm3" or "1.56 kg/m3", found "1e999 g/cm3"'],
      ['name: a\ndensity: 1 g/cm3 wet\n', 'm.txt:2: density must be a positive number with a unit, e.g. "density: 1.56e-3 g/cm3" or "1.56 kg/m3", found "1 g/cm3 wet"'],
      ['name: a\ndensity: about 1 g/cm3\n', 'm.txt:2: density must be a positive number with a unit, e.g. "density: 1.56e-3 g/cm3" or "1.56 kg/m3", found "about 1 g/cm3"'],
      ['name: a\ndensity: 1 g/cm3\nformula: h2o\n', 'm.txt:3: cannot read the formula "h2o"; write element symbols with counts, e.g. "C3H8" or "H2O"'],
      ['name: a\ndensity: 1 g/cm3\nformula: H2O+\n', 'm.txt:3: cannot read the formula "H2O+"; write element symbols with counts, e.g. "C3H8" or "H2O"'],
      ['name: a\ndensity: 1 g/cm3\nformula:\n', 'm.txt:3: cannot read the formula ""; write element symbols with counts, e.g. "C3H8" or "H2O"'],
      ['name: a\ndensity: 1 g/cm3\nformula: Zz2\n', `m.txt:3: unknown element "Zz" in formula "Zz2"; known: H, He, C, N, O, F, Ne, Na, Al, Si, S, Cl, Ar, Ca, Fe, Cu, Br, Ag, I, Xe, W, Pb`],
      ['name: a\ndensity: 1 g/cm3\npart: argon-gas\n', 'm.txt:3: part needs a constituent and a mass fraction in (0, 1], e.g. "part: argon-gas 0.884", found "argon-gas"'],
      ['name: a\ndensity: 1 g/cm3\npart: argon-gas 0\n', 'm.txt:3: part needs a constituent and a mass fraction in (0, 1], e.g. "part: argon-gas 0.884", found "argon-gas 0"'],
      ['name: a\ndensity: 1 g/cm3\npart: argon-gas 1.5\n', 'm.txt:3: part needs a constituent and a mass fraction in (0, 1], e.g. "part: argon-gas 0.884", found "argon-gas 1.5"'],
      ['name: a\ndensity: 1 g/cm3\npart: argon gas 1\n', 'm.txt:3: part needs a constituent and a mass fraction in (0, 1], e.g. "part: argon-gas 0.884", found "argon gas 1"'],
      ['name: a\ndensity: 1 g/cm3\npart: Ar 1x\n', 'm.txt:3: part needs a constituent and a mass fraction in (0, 1], e.g. "part: argon-gas 0.884", found "Ar 1x"'],
      ['name: a\ndensity: 1 g/cm3\nformula: H2O\nexcitation: 85 keV\n', 'm.txt:4: excitation must be a positive energy in eV, e.g. "excitation: 85.7 eV", found "85 keV"'],
      ['name: a\ndensity: 1 g/cm3\nformula: H2O\nexcitation: 0 eV\n', 'm.txt:4: excitation must be a positive energy in eV, e.g. "excitation: 85.7 eV", found "0 eV"'],
      ['name: a\ndensity: 1 g/cm3\nformula: H2O\nexcitation: x85 eV\n', 'm.txt:4: excitation must be a positive energy in eV, e.g. "excitation: 85.7 eV", found "x85 eV"'],
      ['density: 1 g/cm3\nformula: H2O\n', 'm.txt:3: no "name:" line; add one, e.g. "name: my-gas"'],
      ['name: a\ndensity: 1 g/cm3\nformula: H2O\nexcitation: 85 eVx\n', 'm.txt:4: excitation must be a positive energy in eV, e.g. "excitation: 85.7 eV", found "85 eVx"'],
      ['name: a\ndensity: 1 g/cm3\npart: CH4x 1\n', 'm.txt:3: "CH4x" is neither an element symbol, a table material nor a formula; use e.g. "Ar", "argon-gas" or "CH4"'],
      ['name: a\ndensity: 1 g/cm3\npart: xCH4 1\n', 'm.txt:3: "xCH4" is neither an element symbol, a table material nor a formula; use e.g. "Ar", "argon-gas" or "CH4"'],
      ['name: a\ndensity: 1 g/cm3\npart: C1.x 1\n', 'm.txt:3: "C1.x" is neither an element symbol, a table material nor a formula; use e.g. "Ar", "argon-gas" or "CH4"'],
      ['name: a\ndensity: 1 g/cm3\n', 'm.txt:3: no "formula:" line and no "part:" lines; give a formula (e.g. "formula: C3H8") or the parts of a mixture'],
    ];
    for (const [text, message] of msgs) expect(bad(text), text).toBe(`BAD_MATERIAL_FILE ${message}`);
  });
});
