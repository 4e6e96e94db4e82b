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
});
