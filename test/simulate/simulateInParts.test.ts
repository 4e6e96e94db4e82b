import { describe, expect, it } from 'vitest';
import { readScenario } from '../../lib/simulate/scenario.js';
import { simulateChamber, simulateChamberInParts } from '../../lib/simulate/simulate.js';
import { formatHitsCsv, formatRunRecord, formatRunRecordTotals, formatTruthCsv } from '../../lib/simulate/simulationCsv.js';
import { SagittaError } from '../../lib/errors.js';

/**
 * A run simulated in parts (bounded memory, `sagitta simulate` streams this way) is the one-piece
 * run cut at event boundaries: the parts put together give the same hits, truth and run record,
 * byte for byte, for any part size — also one that does not divide the event count.
 */
describe('simulateChamberInParts', () => {
  const config = readScenario('notebooks/data/brindlemoor.scenario.json');
  const whole = simulateChamber(config, 5);

  it.each([1, 7, 64, 350, 10_000])('parts of %i events join to the one-piece bytes', (size) => {
    let hits = '';
    let truth = '';
    let parts = 0;
    let lastEvent = 0;
    const totals = simulateChamberInParts(config, 5, (part) => {
      // Each part holds whole events, after the ones before it.
      for (let i = 0; i < part.hits.length; i++) expect(part.hits.event[i]).toBeGreaterThan(lastEvent);
      if (part.hits.length) lastEvent = part.hits.event[part.hits.length - 1];
      hits += formatHitsCsv(part, { header: parts === 0 });
      truth += formatTruthCsv(part, { header: parts === 0 });
      parts++;
    }, size);
    expect(parts).toBe(Math.max(1, Math.ceil(whole.events / size)));
    expect(hits).toBe(formatHitsCsv(whole));
    expect(truth).toBe(formatTruthCsv(whole));
    const files = { hits: 'h.csv', scenario: 's.json' };
    expect(formatRunRecordTotals(totals, files)).toBe(formatRunRecord(whole, files));
  });

  it('refuses a part size that is not a positive whole number', () => {
    expect(() => simulateChamberInParts(config, 5, () => undefined, 0)).toThrow(SagittaError);
    expect(() => simulateChamberInParts(config, 5, () => undefined, 2.5)).toThrow(/eventsPerPart = 2.5 is not valid/);
  });
});
