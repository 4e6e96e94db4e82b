import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** One row of a NIST PSTAR table as stored in test/fixtures/pstar/<material>.txt. */
export interface PstarRow { readonly t: number; readonly electronic: number; readonly nuclear: number; readonly total: number; readonly range: number }

/** Reads test/fixtures/pstar/<name>.txt (rows of T, S_el, S_nuc, S_tot, CSDA range; # comments). */
export function pstarTable(name: string): PstarRow[] {
  const text = readFileSync(fileURLToPath(new URL(`../fixtures/pstar/${name}.txt`, import.meta.url)), 'utf8');
  return text.split('\n').filter((l) => l.trim() && !l.startsWith('#')).map((l) => {
    const [t, electronic, nuclear, total, range] = l.trim().split(/\s+/).map(Number);
    return { t, electronic, nuclear, total, range };
  });
}
