import fc from 'fast-check';
import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { SagittaError } from '../../lib/errors.js';
import { parseHitsCsv } from '../../lib/io/parseHitsCsv.js';
import { parseHitsJsonl } from '../../lib/io/parseHitsJsonl.js';
import { FIT_STATUS } from '../../lib/fit/circleFit.js';
import { measureTracks } from '../../lib/track/measureTracks.js';
import { fieldTesla, lengthMetres, momentumGeV } from '../../lib/units.js';
import { runFit } from '../../kernel/cli/commands/fit.js';
import { UsageError } from '../../kernel/cli/usage.js';
import { consumeWarnings } from '../../lib/warnings.js';

/**
 * No input crashes or hangs: random hit files (good rows mixed with junk cells, quotes, huge and
 * tiny numbers, repeated points, backwards orders) and random option values either give results
 * (a status per track) or one catalogue error — never another exception. A hang fails through the
 * test timeout.
 */
const scratch = mkdtempSync(join(tmpdir(), 'sagitta-prop-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

const cell = fc.oneof(
  { weight: 8, arbitrary: fc.double({ min: -1e4, max: 1e4, noNaN: true }).map((v) => String(Math.round(v * 1000) / 1000)) },
  { weight: 1, arbitrary: fc.constantFrom('', 'NaN', 'Infinity', '-0', '1e308', '1e-308', '0x1A', '"', '"a,b"', ' 1 ', '1.2.3', '١٢', '9007199254740993', '-9223372036854775808') },
  { weight: 1, arbitrary: fc.string({ maxLength: 6 }) },
);
const idCell = fc.oneof({ weight: 9, arbitrary: fc.integer({ min: -2, max: 5 }).map(String) }, { weight: 1, arbitrary: cell });
const row = fc.tuple(idCell, idCell, cell, cell, cell, fc.constantFrom('0.3', '0', '-1', '', '1e-9'));
const header = fc.constantFrom('event,track,x[mm],y[mm],z[mm],sigma[mm]', 'event,track,x,y,z,sigma', 'event;track;x;y;z;sigma', 'event,track,x[cm],y[cm],z[cm],sigma[um]');

/** A smooth track's rows (so real fits happen), in travel order, reversed or shuffled. */
const track = fc.record({ event: fc.integer({ min: 1, max: 3 }), id: fc.integer({ min: 1, max: 4 }), r: fc.double({ min: 5, max: 1e5, noNaN: true }), n: fc.integer({ min: 0, max: 12 }), step: fc.double({ min: 1e-6, max: 2, noNaN: true }), order: fc.constantFrom('forward', 'reverse', 'zigzag') })
  .map((t) => {
    const idx = Array.from({ length: t.n }, (_, i) => i);
    if (t.order === 'reverse') idx.reverse();
    if (t.order === 'zigzag') idx.sort((a, b) => (a % 2) - (b % 2) || a - b);
    return idx.map((i) => [t.event, t.id, t.r * Math.sin(i * t.step), t.r * (1 - Math.cos(i * t.step)), i, 0.3].map((v) => (typeof v === 'number' ? String(Math.round(v * 1e6) / 1e6) : v)));
  });

function onlyCatalogueErrors(body: () => void): void {
  try {
    body();
  } catch (err) {
    if (!(err instanceof SagittaError || err instanceof UsageError)) throw err;
    expect(err.message).not.toMatch(/\n/);
  }
}

describe('random hit files never crash the reader or the fit', () => {
  it('CSV: rows of junk and real tracks give a HitTable and statuses, or one catalogue error', () => {
    fc.assert(
      fc.property(header, fc.array(fc.oneof(row, track.map((rows) => rows[0] ?? ['1', '1', '0', '0', '0', '0.3'])), { maxLength: 30 }), fc.array(track, { maxLength: 4 }), (h, junk, tracks) => {
        const sep = h.includes(';') ? ';' : ',';
        const lines = [h, ...[...tracks.flat(), ...junk].map((r) => r.join(sep))];
        const bytes = new TextEncoder().encode(lines.join('\n') + '\n');
        onlyCatalogueErrors(() => {
          const hits = parseHitsCsv(bytes, 'random.csv');
          const fitted = measureTracks(hits, { fieldT: 1.5 });
          for (const s of fitted.status) expect(FIT_STATUS).toContain(s);
          expect(fitted.count).toBe(fitted.status.length);
        });
        consumeWarnings();
      }),
      { numRuns: 300, seed: 13 },
    );
  });

  it('JSON Lines: objects with random keys and values give a HitTable or one catalogue error', () => {
    const value = fc.oneof(fc.double({ noNaN: false }), fc.integer(), fc.string({ maxLength: 4 }), fc.constant(null), fc.boolean(), fc.constant([1]), fc.constant({ a: 1 }));
    const object = fc.record({ event: value, track: value, x: value, y: value }, { requiredKeys: [] });
    const goodLine = fc.record({ event: fc.integer({ min: 0, max: 3 }), track: fc.integer({ min: -1, max: 3 }), x: fc.double({ min: -1, max: 1, noNaN: true }), y: fc.double({ min: -1, max: 1, noNaN: true }) });
    const line = fc.oneof({ weight: 6, arbitrary: goodLine.map((o) => JSON.stringify(o)) }, { weight: 1, arbitrary: object.map((o) => JSON.stringify(o)) }, { weight: 1, arbitrary: fc.string({ maxLength: 12 }) });
    fc.assert(
      fc.property(fc.array(line, { maxLength: 30 }), (lines) => {
        onlyCatalogueErrors(() => {
          const hits = parseHitsJsonl(new TextEncoder().encode(lines.join('\n')), 'random.jsonl', { lengthUnit: 'm' });
          measureTracks(hits, { fieldT: -0.5 });
        });
        consumeWarnings();
      }),
      { numRuns: 300, seed: 7 },
    );
  });
});

describe('random quantity texts never crash and never give a non-finite value', () => {
  const unit = fc.constantFrom('T', 'kG', 'mT', 'G', 'm', 'mm', 'um', 'cm', 'MeV', 'GeV/c', 'MeV/c', 's', '', 'kg', 'T^2', 'deg');
  const number = fc.oneof(fc.double({ noNaN: false }).map(String), fc.integer().map(String), fc.constantFrom('1e400', '-0', '.5', '5.', '0x10', '1_000', 'Infinity'));
  const expr = fc.oneof(
    fc.tuple(number, fc.constantFrom(' ', '', '  '), unit).map(([n, s, u]) => `${n}${s}${u}`),
    fc.tuple(fc.constantFrom('sqrt', 'log', 'exp', 'sin', 'abs', '-', ''), number, unit, fc.constantFrom('', ' 2', ' * 2', ' + 1 T', '^2', '!', ' to mT')).map(([f, n, u, tail]) => `${f}(${n}) ${u}${tail}`),
    fc.string({ maxLength: 12 }),
  );
  it('fieldTesla, lengthMetres and momentumGeV return a finite number or throw one catalogue error', () => {
    fc.assert(
      fc.property(expr, (text) => {
        for (const read of [fieldTesla, lengthMetres, momentumGeV]) {
          onlyCatalogueErrors(() => {
            const v = read(text, { what: '--value' });
            expect(Number.isFinite(v)).toBe(true);
          });
        }
      }),
      { numRuns: 400, seed: 5 },
    );
  });
});

describe('random option values for sagitta fit (in-process)', () => {
  it('give a summary or a catalogue refusal; nothing is left in the folder but the input and a complete output', async () => {
    const dir = mkdtempSync(join(scratch, 'fit-'));
    const input = join(dir, 'hits.csv');
    const rows = ['event,track,x[mm],y[mm],z[mm]'];
    for (let t = 1; t <= 3; t++) for (let i = 0; i < 8; i++) rows.push(`1,${t},${(300 * Math.sin(0.1 * i * t)).toFixed(3)},${(300 - 300 * Math.cos(0.1 * i * t)).toFixed(3)},${i}`);
    writeFileSync(input, rows.join('\n') + '\n');
    const text = fc.oneof(fc.string({ maxLength: 8 }), fc.constantFrom('1.5 T', '-2 T', '0 T', '1e400 T', '300 um', '-1 mm', '2', '0', '3/4', '5/4', '1/1', 'kg', 'cm', '__proto__'));
    await fc.assert(
      fc.asyncProperty(fc.record({ field: text, hitError: fc.option(text, { nil: undefined }), lengthUnit: fc.constantFrom('mm', 'cm', 'kg', 'm', ''), chargeNumber: fc.constantFrom('1', '2', '-1', 'x'), shard: fc.option(text, { nil: undefined }), threads: fc.constantFrom(undefined, '1', '2', '0'), out: fc.constantFrom(undefined, 'o.csv', 'o.jsonl', 'o.parquet', 'o.txt', 'hits.csv', 'none/o.csv') }), async (o) => {
        const options = { ...o, fitter: 'geometric', particle: 'pi+', quiet: true, out: o.out === undefined ? undefined : join(dir, o.out) };
        if (options.out === undefined) return; // stdout results are covered by the CLI tests; keep this run's output quiet
        try {
          await runFit(input, options);
        } catch (err) {
          if (!(err instanceof SagittaError || err instanceof UsageError)) throw err;
          expect(err.message).not.toMatch(/\n/);
        }
        consumeWarnings();
        const left = readdirSync(dir).filter((f) => f !== 'hits.csv');
        expect(left.every((f) => /^o\.(csv|jsonl|parquet)$/.test(f))).toBe(true);
        for (const f of left) rmSync(join(dir, f));
      }),
      { numRuns: 120, seed: 11 },
    );
  }, 120_000);
});
