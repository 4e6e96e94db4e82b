import { describe, expect, it } from 'vitest';
import { GEV_PER_TESLA_METRE } from '../../lib/constants.js';
import { parseScenario, simulateChamber } from '../../lib/simulate/index.js';

/** A small tracker scenario with a burst source: many helices per event from one spot. */
const scenario = JSON.stringify({
  format: 'sagitta-scenario/1',
  name: 'burst-check',
  chamber: { size: ['120 cm', '120 cm', '100 cm'], medium: 'vacuum', field: '1 T' },
  measurement: { spacing: '10 mm', resolution: '300 um' },
  sources: [{
    type: 'burst', events: 40, multiplicity: [10, 20], species: { 'mu-': 1, 'mu+': 1 },
    ptRange: ['0.1 GeV/c', '2 GeV/c'], tanLambdaRange: [-1, 1], origin: ['0 cm', '0 cm', '0 cm'], spot: '1 mm',
  }],
});

describe('burst source (many helices per event from a common region)', () => {
  const config = parseScenario(scenario, 'burst.json');
  const run = simulateChamber(config, 5);
  const t = run.truth;

  it('draws a whole number of particles per event in the multiplicity range, each from the event\'s common start point', () => {
    const perEvent = new Map<number, number[]>();
    for (let i = 0; i < t.length; i++) {
      const rows = perEvent.get(t.event[i]) ?? [];
      rows.push(i);
      perEvent.set(t.event[i], rows);
    }
    expect(perEvent.size).toBe(40);
    let checked = 0;
    for (const rows of perEvent.values()) {
      expect(rows.length).toBeGreaterThanOrEqual(10);
      expect(rows.length).toBeLessThanOrEqual(20);
      for (const i of rows) {
        expect(t.process[i]).toBe('burst');
        expect(t.vx[i]).toBe(t.vx[rows[0]]);
        expect(t.vz[i]).toBe(t.vz[rows[0]]);
        checked++;
      }
    }
    expect(checked).toBe(t.length);
  });

  it('gives p_T in the range, tan λ in the range, and helices of radius p_T/(0.2998 B) (vacuum: no loss)', () => {
    let n = 0;
    for (let i = 0; i < t.length; i++) {
      const pt = Math.hypot(t.px[i], t.py[i]);
      expect(pt).toBeGreaterThanOrEqual(0.1 * (1 - 1e-12));
      expect(pt).toBeLessThanOrEqual(2 * (1 + 1e-12));
      expect(Math.abs(t.pz[i] / pt)).toBeLessThanOrEqual(1 + 1e-12);
      n++;
    }
    expect(n).toBe(t.length);
    // Truth hits of track 1 of event 1 lie on a circle of R = p_T/(0.299792458·B) (common practice).
    const first = t.event.findIndex((e) => e === 1);
    const R = Math.hypot(t.px[first], t.py[first]) / (GEV_PER_TESLA_METRE * 1);
    const rows = Array.from({ length: run.hits.length }, (_, i) => i).filter((i) => run.hits.event[i] === 1 && run.hits.track[i] === 1);
    expect(rows.length).toBeGreaterThan(10);
    const q = t.charge[first];
    // Centre to the right of travel for q > 0 in B along +z.
    const ux = t.px[first], uy = t.py[first], pt = Math.hypot(ux, uy);
    const cx = t.vx[first] + q * R * (uy / pt), cy = t.vy[first] - q * R * (ux / pt);
    for (const i of rows) expect(Math.hypot(run.hitTruth.x[i] - cx, run.hitTruth.y[i] - cy)).toBeCloseTo(R, 6);
  });
});
