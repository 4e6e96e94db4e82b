/**
 * Lays the events of one simulation over those of another: event e of `base` gets events
 * (e−1)·k + 1 … e·k of `extra` (k = `perEvent`), their tracks renumbered from 100·j + 1 for the
 * j-th one laid over (noise hits keep track −1; parents are renumbered alike), so that an event
 * holds, say, a V⁰ decay and prompt tracks from the same target. Used only to make demo data;
 * the simulator itself makes one source's particle per event.
 */
import type { SimulationResult } from 'sagitta-tracks';

function rowsByEvent(event: Float64Array): Map<number, number[]> {
  const m = new Map<number, number[]>();
  for (let i = 0; i < event.length; i++) {
    let list = m.get(event[i]);
    if (!list) m.set(event[i], (list = []));
    list.push(i);
  }
  return m;
}

export function overlayEvents(base: SimulationResult, extra: SimulationResult, perEvent: number, name: string): SimulationResult {
  const pick = <T extends Float64Array>(a: T, b: T, rows: [0 | 1, number][], f?: (v: number, j: number, src: 0 | 1) => number, shift?: number[]) =>
    Float64Array.from(rows, ([src, i], r) => (f ? f((src ? b : a)[i], shift![r], src) : (src ? b : a)[i]));
  const merge = (baseEvent: Float64Array, extraEvent: Float64Array) => {
    const bRows = rowsByEvent(baseEvent), eRows = rowsByEvent(extraEvent);
    const rows: [0 | 1, number][] = [];
    const events: number[] = [], shift: number[] = [];
    for (let e = 1; e <= base.events; e++) {
      for (const i of bRows.get(e) ?? []) { rows.push([0, i]); events.push(e); shift.push(0); }
      for (let j = 0; j < perEvent; j++) {
        for (const i of eRows.get((e - 1) * perEvent + j + 1) ?? []) { rows.push([1, i]); events.push(e); shift.push(100 * (j + 1)); }
      }
    }
    return { rows, events: Float64Array.from(events), shift };
  };
  const renumber = (v: number, s: number) => (v > 0 ? v + s : v);
  const h = merge(base.hits.event, extra.hits.event);
  const hits = {
    ...base.hits,
    length: h.rows.length,
    event: h.events,
    track: pick(base.hits.track, extra.hits.track, h.rows, renumber, h.shift),
    x: pick(base.hits.x, extra.hits.x, h.rows), y: pick(base.hits.y, extra.hits.y, h.rows), z: pick(base.hits.z!, extra.hits.z!, h.rows),
    sigmaX: pick(base.hits.sigmaX!, extra.hits.sigmaX!, h.rows), sigmaY: pick(base.hits.sigmaY!, extra.hits.sigmaY!, h.rows), sigmaZ: pick(base.hits.sigmaZ!, extra.hits.sigmaZ!, h.rows),
    source: { ...base.hits.source, file: `(overlay: ${name})` },
  };
  const hitTruth = {
    x: pick(base.hitTruth.x, extra.hitTruth.x, h.rows), y: pick(base.hitTruth.y, extra.hitTruth.y, h.rows),
    z: pick(base.hitTruth.z, extra.hitTruth.z, h.rows), momentumGeV: pick(base.hitTruth.momentumGeV, extra.hitTruth.momentumGeV, h.rows),
  };
  const bt = base.truth, et = extra.truth;
  const t = merge(bt.event, et.event);
  const str = (a: readonly string[], b: readonly string[]) => t.rows.map(([src, i]) => (src ? b : a)[i]);
  const truth = {
    length: t.rows.length, event: t.events,
    track: pick(bt.track, et.track, t.rows, renumber, t.shift), parent: pick(bt.parent, et.parent, t.rows, renumber, t.shift),
    species: str(bt.species, et.species), charge: pick(bt.charge, et.charge, t.rows), process: str(bt.process, et.process),
    vx: pick(bt.vx, et.vx, t.rows), vy: pick(bt.vy, et.vy, t.rows), vz: pick(bt.vz, et.vz, t.rows),
    px: pick(bt.px, et.px, t.rows), py: pick(bt.py, et.py, t.rows), pz: pick(bt.pz, et.pz, t.rows),
    end: str(bt.end, et.end), ex: pick(bt.ex, et.ex, t.rows), ey: pick(bt.ey, et.ey, t.rows), ez: pick(bt.ez, et.ez, t.rows),
    pathM: pick(bt.pathM, et.pathM, t.rows), hits: pick(bt.hits, et.hits, t.rows),
  };
  return { name, seed: base.seed, events: base.events, hits, hitTruth, truth };
}
