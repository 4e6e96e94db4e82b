import type { SimulationResult, SimulationTotals } from './simulate.js';

/** For a run written in parts: only the first part carries the header line. */
export interface CsvPartOptions {
  readonly header?: boolean;
}

/**
 * Text forms of a simulation result with stable number formatting (fixed decimals, no "-0"), so
 * that the same scenario and seed give identical bytes on every machine.
 *
 * Hits: `event,track,x[mm],y[mm],z[mm],sigma[mm],sigma_z[mm]` (or `sigma_x[mm],sigma_y[mm]` when
 * the two bending-plane errors differ), one row per hit, rows of a track together in travel
 * order, noise hits first in their event with track −1 — the columns lib/io reads.
 * Truth: one row per particle, see `TRUTH_CSV_COLUMNS`.
 */
export const TRUTH_CSV_COLUMNS = [
  'event', 'track', 'parent', 'species', 'charge', 'process',
  'vx[mm]', 'vy[mm]', 'vz[mm]', 'px[MeV/c]', 'py[MeV/c]', 'pz[MeV/c]', 'p[MeV/c]',
  'end', 'ex[mm]', 'ey[mm]', 'ez[mm]', 'path[mm]', 'hits',
] as const;

/** Fixed-point text; rounding to zero prints without a minus sign. */
export function fixed(value: number, decimals: number): string {
  const s = value.toFixed(decimals);
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
}

export function formatHitsCsv(result: SimulationResult, options: CsvPartOptions = {}): string {
  const h = result.hits;
  const sx = h.sigmaX!, sy = h.sigmaY!, sz = h.sigmaZ!, z = h.z!;
  let same = true;
  for (let i = 0; i < h.length && same; i++) same = sx[i] === sy[i];
  const parts: string[] = options.header === false ? [] : [same
    ? 'event,track,x[mm],y[mm],z[mm],sigma[mm],sigma_z[mm]\n'
    : 'event,track,x[mm],y[mm],z[mm],sigma_x[mm],sigma_y[mm],sigma_z[mm]\n'];
  for (let i = 0; i < h.length; i++) {
    const sig = same ? fixed(sx[i] * 1e3, 4) : `${fixed(sx[i] * 1e3, 4)},${fixed(sy[i] * 1e3, 4)}`;
    parts.push(`${h.event[i]},${h.track[i]},${fixed(h.x[i] * 1e3, 4)},${fixed(h.y[i] * 1e3, 4)},${fixed(z[i] * 1e3, 4)},${sig},${fixed(sz[i] * 1e3, 4)}\n`);
  }
  return parts.join('');
}

export function formatTruthCsv(result: SimulationResult, options: CsvPartOptions = {}): string {
  const t = result.truth;
  const parts: string[] = options.header === false ? [] : [TRUTH_CSV_COLUMNS.join(',') + '\n'];
  const mm = (v: number) => fixed(v * 1e3, 4);
  const mev = (v: number) => fixed(v * 1e3, 4);
  for (let i = 0; i < t.length; i++) {
    const p = Math.hypot(t.px[i], t.py[i], t.pz[i]);
    parts.push([
      t.event[i], t.track[i], t.parent[i], t.species[i], t.charge[i], t.process[i],
      mm(t.vx[i]), mm(t.vy[i]), mm(t.vz[i]), mev(t.px[i]), mev(t.py[i]), mev(t.pz[i]), mev(p),
      t.end[i], mm(t.ex[i]), mm(t.ey[i]), mm(t.ez[i]), mm(t.pathM[i]), t.hits[i],
    ].join(',') + '\n');
  }
  return parts.join('');
}

/**
 * The run record written beside the hits: scenario name, seed, counts and the files made.
 * Deliberately free of dates and versions so that a regeneration is byte-identical.
 */
export function formatRunRecord(result: SimulationResult, files: Readonly<Record<string, string>>, scenario?: unknown): string {
  const bySpecies: Record<string, number> = {};
  for (const sp of result.truth.species) bySpecies[sp] = (bySpecies[sp] ?? 0) + 1;
  const totals: SimulationTotals = { name: result.name, seed: result.seed, events: result.events, hitRows: result.hits.length, particles: result.truth.length, particlesBySpecies: bySpecies };
  return formatRunRecordTotals(totals, files, scenario);
}

/** As `formatRunRecord`, from the counts of a run simulated in parts (`simulateChamberInParts`). */
export function formatRunRecordTotals(totals: SimulationTotals, files: Readonly<Record<string, string>>, scenario?: unknown): string {
  const record = {
    format: 'sagitta-run/1',
    // Said in the record itself, so a report that reads these hits can mark its results simulated.
    simulated: true,
    scenario: totals.name,
    seed: totals.seed,
    events: totals.events,
    hitRows: totals.hitRows,
    particles: totals.particles,
    particlesBySpecies: Object.fromEntries(Object.entries(totals.particlesBySpecies).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))),
    files,
    ...(scenario !== undefined ? { scenarioDocument: scenario } : {}),
  };
  return JSON.stringify(record, null, 2) + '\n';
}
