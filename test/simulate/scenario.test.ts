import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { SagittaError } from '../../lib/errors.js';
import { parseScenario, resolveScenario } from '../../lib/simulate/index.js';

const demoText = readFileSync(new URL('../../notebooks/data/brindlemoor.scenario.json', import.meta.url), 'utf8');
const demo = () => JSON.parse(demoText) as Record<string, any>;

function errorOf(doc: unknown): SagittaError {
  try {
    resolveScenario(doc, 'run.json');
  } catch (err) {
    if (err instanceof SagittaError) return err;
    throw err;
  }
  throw new Error('expected a BAD_SCENARIO error');
}

describe('scenario files: schema validation with errors that name the path', () => {
  it('the demo scenario resolves to internal units (cm → m, T, MeV/c → GeV/c, mrad → rad)', () => {
    const c = parseScenario(demoText, 'brindlemoor.scenario.json');
    expect(c.name).toBe('brindlemoor');
    expect(c.chamber.xMaxM - c.chamber.xMinM).toBeCloseTo(1.2, 12);
    expect(c.chamber.field).toEqual({ kind: 'uniform', bxT: 0, byT: 0, bzT: 1.5 });
    expect(c.measurement.sigmaZM).toBeCloseTo(1.2e-3, 15);
    const beam = c.sources[0];
    expect(beam.kind).toBe('beam');
    if (beam.kind === 'beam') {
      expect(beam.momentumGeV).toBeCloseTo(0.5, 12);
      expect(beam.divergenceRad).toBeCloseTo(0.004, 12);
      expect(beam.species.map((s) => s.particle.name)).toEqual(['pi-', 'proton', 'mu-']);
    }
  });

  it('an unknown field is named with its path', () => {
    const d = demo();
    d.chamber.colour = 'blue';
    const e = errorOf(d);
    expect(e.code).toBe('BAD_SCENARIO');
    expect(e.message).toMatch(/^run\.json: \/chamber: unknown field 'colour'/);
  });

  it('a quantity of the wrong dimension names the path and the expected kind', () => {
    const d = demo();
    d.chamber.field = '1.5 m';
    expect(errorOf(d).message).toMatch(/\/chamber\/field: .*"1\.5 m" is not a magnetic field/);
  });

  it('a bare number where a quantity is needed says what to write', () => {
    const d = demo();
    d.sources[1].momentum = '700';
    expect(errorOf(d).message).toMatch(/\/sources\/1\/momentum: "700" must be a number and a unit \(mean momentum, e\.g\. "600 MeV\/c"\)/);
  });

  it('a wrong enum value lists the allowed values; a missing field is named', () => {
    const d = demo();
    d.transport.energyLoss = 'landau';
    d.sources[2].parent = 'K+';
    delete d.sources[0].momentum;
    const m = errorOf(d).message;
    expect(m).toMatch(/\/transport\/energyLoss: must be one of "mean", "straggling", "off"/);
    expect(m).toMatch(/\/sources\/2\/parent: must be one of "K0S", "Lambda"/);
    expect(m).toMatch(/\/sources\/0: missing field 'momentum'/);
  });

  it('an unknown species or medium is reported at its path', () => {
    const d = demo();
    d.sources[0].species = { 'pi-': 1, 'tachyon': 1 };
    expect(errorOf(d).message).toMatch(/\/sources\/0\/species\/tachyon: unknown particle "tachyon"/);
    const d2 = demo();
    d2.chamber.medium = 'unobtainium';
    expect(errorOf(d2).message).toMatch(/\/chamber\/medium: unknown material "unobtainium"/);
  });

  it('a start point outside the chamber and a missing sampling rule are refused', () => {
    const d = demo();
    d.sources[0].origin = ['-80 cm', '0 cm', '0 cm'];
    expect(errorOf(d).message).toMatch(/\/sources\/0\/origin: the point lies outside the chamber/);
    const d2 = demo();
    delete d2.measurement.spacing;
    expect(errorOf(d2).message).toMatch(/\/measurement: give exactly one of 'spacing'/);
  });

  it('broken JSON is reported with line and column', () => {
    const bad = demoText.replace('"medium": "liquid hydrogen",', '"medium": "liquid hydrogen"');
    expect(() => parseScenario(bad, 'x.json')).toThrow(/x\.json: not valid JSON \(line 9, column 5\)/);
  });

  it('planes given as from/to/count become evenly spaced positions', () => {
    const d = demo();
    delete d.measurement.spacing;
    d.measurement.planes = { axis: 'x', from: '-50 cm', to: '50 cm', count: 11 };
    const c = resolveScenario(d);
    const s = c.measurement.sampling;
    expect(s.kind).toBe('planes');
    if (s.kind === 'planes') {
      expect(s.axis).toBe(0);
      expect(s.positionsM.length).toBe(11);
      s.positionsM.forEach((x, i) => expect(x).toBeCloseTo(-0.5 + 0.1 * i, 12));
    }
  });
});
