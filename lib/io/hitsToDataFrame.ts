import { createRequire } from 'node:module';
import type { DataFrame } from 'danfojs-node';
import type { HitTable } from './hitTable.js';

type Danfo = typeof import('danfojs-node');
let danfo: Danfo | undefined;

/**
 * Loads danfojs-node on first use only: it brings TensorFlow.js (about a second to load), which
 * command-line fits never need. DataFrames are for notebooks and display, never for fit loops.
 */
export function loadDanfo(): Danfo {
  danfo ??= createRequire(import.meta.url)('danfojs-node') as Danfo;
  return danfo;
}

/**
 * A hit table as a danfojs DataFrame for notebooks, with lengths in `unit` (default 'mm';
 * column names carry it, e.g. `x_mm`).
 */
export function hitsToDataFrame(table: HitTable, unit: 'um' | 'mm' | 'cm' | 'm' = 'mm'): DataFrame {
  const f = { um: 1e6, mm: 1e3, cm: 1e2, m: 1 }[unit];
  const scaled = (c: Float64Array): number[] => Array.from(c, (v) => v * f);
  const data: Record<string, number[]> = {
    event: Array.from(table.event),
    track: Array.from(table.track),
    [`x_${unit}`]: scaled(table.x),
    [`y_${unit}`]: scaled(table.y),
  };
  if (table.z) data[`z_${unit}`] = scaled(table.z);
  if (table.sigmaX) data[`sigma_x_${unit}`] = scaled(table.sigmaX);
  if (table.sigmaY) data[`sigma_y_${unit}`] = scaled(table.sigmaY);
  if (table.sigmaZ) data[`sigma_z_${unit}`] = scaled(table.sigmaZ);
  const { DataFrame: Frame } = loadDanfo();
  return new Frame(data);
}
