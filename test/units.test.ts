import { describe, expect, it } from 'vitest';
import { fieldTesla, lengthMetres, energyMeV, momentumGeV, metresPerUnit, quantity } from '../lib/units.js';
import { SagittaError } from '../lib/errors.js';

describe('units at the boundary', () => {
  it('fieldTesla reads T, mT, G and kG (1 G = 1e-4 T exactly, SI definition of the gauss)', () => {
    expect(fieldTesla('1.5 T')).toBeCloseTo(1.5, 15);
    expect(fieldTesla('1500 mT')).toBeCloseTo(1.5, 12);
    expect(fieldTesla('15 kG')).toBeCloseTo(1.5, 12);
    expect(fieldTesla('20000 G')).toBeCloseTo(2, 12);
    expect(fieldTesla('5 kgauss')).toBeCloseTo(0.5, 12);
  });
  it('lengthMetres reads um, µm, mm, cm and m', () => {
    expect(lengthMetres('300 um')).toBeCloseTo(3e-4, 15);
    expect(lengthMetres('2.5 cm')).toBeCloseTo(0.025, 15);
    expect(metresPerUnit('µm')).toBeCloseTo(1e-6, 18);
    expect(metresPerUnit('mm')).toBe(0.001);
  });
  it('energyMeV and momentumGeV read eV…TeV with or without /c', () => {
    expect(energyMeV('2 GeV')).toBeCloseTo(2000, 9);
    expect(energyMeV('1 TeV')).toBeCloseTo(1e6, 6);
    expect(momentumGeV('350 MeV/c')).toBeCloseTo(0.35, 12);
    expect(momentumGeV('2.1 GeV/c')).toBeCloseTo(2.1, 12);
  });
  it('a bare number is refused unless a default unit is declared', () => {
    expect(() => fieldTesla('1.5')).toThrow(SagittaError);
    expect(() => fieldTesla('1.5')).toThrow(/has no unit/);
    expect(quantity('12', 'length', { defaultUnit: 'mm' })).toBeCloseTo(0.012, 15);
  });
  it('a quantity of the wrong dimension names the text and the expected kind', () => {
    expect(() => fieldTesla('3 cm')).toThrow(/"3 cm" is not a magnetic field/);
    expect(() => metresPerUnit('kg')).toThrow(/unknown unit "kg"/);
  });
});

describe('units read without mathjs agree with mathjs', () => {
  it('every unit of the direct table converts exactly as mathjs converts it', async () => {
    const { DIRECT_UNITS } = await import('../lib/units.js');
    for (const [dimension, table] of Object.entries(DIRECT_UNITS)) {
      for (const unit of Object.keys(table)) {
        const suffix = dimension === 'momentum' ? '/c' : '';
        const direct = quantity(`2.5 ${unit}${suffix}`, dimension as Parameters<typeof quantity>[1]);
        // Parentheses keep the text off the direct path, so mathjs evaluates it.
        const viaMathjs = quantity(`(2.5 ${unit})${suffix}`, dimension as Parameters<typeof quantity>[1]);
        expect(direct).toBeCloseTo(viaMathjs, 12);
        expect(Math.abs(direct - viaMathjs)).toBeLessThanOrEqual(1e-12 * Math.abs(viaMathjs));
      }
    }
  });
});

describe('angles and areal densities (one parser for the scenario and the range command)', () => {
  it('angleRad("3 mrad") = 0.003, angleRad("0.5 deg") = π/360; a length is the wrong dimension', async () => {
    const { angleRad } = await import('../lib/units.js');
    expect(angleRad('3 mrad')).toBe(0.003);
    expect(angleRad('0.5 deg')).toBeCloseTo(Math.PI / 360, 15);
    expect(() => angleRad('3 mm')).toThrow(/is not an angle/);
  });
  it('arealDensityGcm2 reads g/cm2, g/cm^2, g/cm², g / cm2 and kg/m2 alike (1 kg/m² = 0.1 g/cm²)', async () => {
    const { arealDensityGcm2 } = await import('../lib/units.js');
    for (const t of ['7 g/cm2', '7 g/cm^2', '7 g/cm²', '7 g / cm2', '70 kg/m2']) expect([t, arealDensityGcm2(t)]).toEqual([t, 7]);
    expect(() => arealDensityGcm2('7 cm')).toThrow(/is not an areal density/);
  });
});
