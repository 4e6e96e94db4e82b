import { fieldTesla, lengthMetres } from '../../lib/index.js';
import { metresPerUnit, msg } from '../../lib/internal.js';

/** The options every command that reads a hit file shares, as the user typed them. */
export interface HitFileOptionsText {
  readonly field: string;
  readonly lengthUnit: string;
  readonly hitError?: string;
}

/**
 * `--field` (non-zero, finite, in T), `--length-unit` and `--hit-error` (positive length) checked,
 * each refusal naming its flag (usage error, exit 2).
 */
export function checkHitFileOptions(o: HitFileOptionsText): { fieldT: number; hitErrorM?: number } {
  const fieldT = fieldTesla(o.field, { what: '--field' });
  if (fieldT === 0 || !Number.isFinite(fieldT)) throw msg.badArgument('--field', o.field, 'a non-zero finite field, e.g. "1.5 T"');
  metresPerUnit(o.lengthUnit, { column: '--length-unit' });
  if (o.hitError === undefined) return { fieldT };
  const hitErrorM = lengthMetres(o.hitError, { what: '--hit-error' });
  if (!(hitErrorM > 0 && Number.isFinite(hitErrorM))) throw msg.badArgument('--hit-error', o.hitError, 'a positive length, e.g. "200 um"');
  return { fieldT, hitErrorM };
}
