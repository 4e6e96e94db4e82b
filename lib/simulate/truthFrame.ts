import type { DataFrame } from 'danfojs-node';
import { loadDanfo } from '../io/hitsToDataFrame.js';
import type { TruthTable } from './simulate.js';

/**
 * The truth table as a danfojs DataFrame for notebooks (danfojs is loaded on first use), with
 * lengths in mm and momenta in MeV/c as in the truth CSV: columns event, track, parent, species,
 * charge, process, vx_mm, vy_mm, vz_mm, px_MeV, py_MeV, pz_MeV, p_MeV, end, ex_mm, ey_mm, ez_mm,
 * path_mm, hits.
 */
export function truthToDataFrame(truth: TruthTable): DataFrame {
  const { DataFrame: Frame } = loadDanfo();
  const mm = (a: Float64Array) => Array.from(a, (v) => v * 1e3);
  const p = Array.from(truth.px, (px, i) => Math.hypot(px, truth.py[i], truth.pz[i]) * 1e3);
  return new Frame({
    event: Array.from(truth.event), track: Array.from(truth.track), parent: Array.from(truth.parent),
    species: [...truth.species], charge: Array.from(truth.charge), process: [...truth.process],
    vx_mm: mm(truth.vx), vy_mm: mm(truth.vy), vz_mm: mm(truth.vz),
    px_MeV: mm(truth.px), py_MeV: mm(truth.py), pz_MeV: mm(truth.pz), p_MeV: p,
    end: [...truth.end], ex_mm: mm(truth.ex), ey_mm: mm(truth.ey), ez_mm: mm(truth.ez),
    path_mm: mm(truth.pathM), hits: Array.from(truth.hits),
  });
}
