import { msg } from '../errors.js';
import { ELEMENTS } from './elements.js';
import { compound, material as tableMaterial, mixture, type Material, type MixturePart } from './materials.js';

/**
 * A user-defined compound or mixture from a small text file (Sagitta's own format; one
 * `key: value` per line, `#` starts a comment, keys in any order, blank lines ignored):
 *
 *   name: ar-ch4-90-10            required; lower case, digits and hyphens
 *   density: 1.56e-3 g/cm3        required; g/cm3 (or g/cm³) or kg/m3
 *   state: gas                    optional; solid (default), liquid or gas
 *   formula: C3H8                 a compound by chemical formula …
 *   part: argon-gas 0.884         … or a mixture: one `part:` line per constituent, an element
 *   part: CH4 0.116                   symbol, a table material name or a formula, and its mass
 *                                     fraction (fractions must sum to 1 within 1 %)
 *   excitation: 85.7 eV           optional; a measured mean excitation energy I
 *
 * `formula` and `part` exclude each other. The result is built by `compound` / `mixture`
 * (Bragg additivity, Sternheimer–Peierls density effect) and so is marked `approximate`;
 * stopping below the proton-equivalent 2 MeV is the scaled-reference extrapolation and warns.
 * Every problem is one BAD_MATERIAL_FILE error naming file:line and what to write instead.
 * @example parseMaterialFile('name: propane-gas\ndensity: 1.879e-3 g/cm3\nstate: gas\nformula: C3H8\n', 'propane.txt')
 */
export function parseMaterialFile(text: string, fileName: string): Material {
  let name: string | undefined;
  let density: number | undefined;
  let state: 'solid' | 'liquid' | 'gas' = 'solid';
  let formula: Record<string, number> | undefined;
  let excitation: number | undefined;
  let formulaLine = 0;
  const parts: MixturePart[] = [];
  let firstPartLine = 0;
  const lines = text.split(/\r?\n/);
  lines.forEach((raw, i) => {
    const line = i + 1;
    const body = raw.replace(/#.*$/, '').trim();
    if (!body) return;
    const m = /^([a-z]+)\s*:\s*(.*)$/.exec(body);
    if (!m) throw msg.badMaterialFile(fileName, line, `expected "key: value" (keys: name, density, state, formula, part, excitation), found ${JSON.stringify(body)}`);
    const [, key, value] = m;
    switch (key) {
      case 'name':
        if (!/^[a-z0-9][a-z0-9-]*$/.test(value)) throw msg.badMaterialFile(fileName, line, `name ${JSON.stringify(value)} must be lower case letters, digits and hyphens, e.g. "ar-ch4-90-10"`);
        name = value;
        break;
      case 'density':
        density = densityGcm3(value, fileName, line);
        break;
      case 'state':
        if (value !== 'solid' && value !== 'liquid' && value !== 'gas') throw msg.badMaterialFile(fileName, line, `state ${JSON.stringify(value)} must be solid, liquid or gas`);
        state = value;
        break;
      case 'formula':
        formula = parseFormula(value, fileName, line);
        formulaLine = line;
        break;
      case 'part': {
        const p = /^(\S+)\s+([0-9.eE+-]+)$/.exec(value);
        const w = p ? Number(p[2]) : NaN;
        if (!p || !(w > 0 && w <= 1)) throw msg.badMaterialFile(fileName, line, `part needs a constituent and a mass fraction in (0, 1], e.g. "part: argon-gas 0.884", found ${JSON.stringify(value)}`);
        parts.push({ of: constituent(p[1], fileName, line), massFraction: w });
        firstPartLine ||= line;
        break;
      }
      case 'excitation': {
        const e = /^([0-9.eE+-]+)\s*eV$/.exec(value);
        excitation = e ? Number(e[1]) : NaN;
        if (!(excitation! > 0)) throw msg.badMaterialFile(fileName, line, `excitation must be a positive energy in eV, e.g. "excitation: 85.7 eV", found ${JSON.stringify(value)}`);
        break;
      }
      default:
        throw msg.badMaterialFile(fileName, line, `unknown key "${key}"; the keys are name, density, state, formula, part, excitation`);
    }
  });
  const end = lines.length;
  if (name === undefined) throw msg.badMaterialFile(fileName, end, 'no "name:" line; add one, e.g. "name: my-gas"');
  if (density === undefined) throw msg.badMaterialFile(fileName, end, 'no "density:" line; add one, e.g. "density: 1.56e-3 g/cm3"');
  if (formula && parts.length) throw msg.badMaterialFile(fileName, firstPartLine, `"part:" lines and the "formula:" on line ${formulaLine} exclude each other; keep one`);
  if (!formula && !parts.length) throw msg.badMaterialFile(fileName, end, 'no "formula:" line and no "part:" lines; give a formula (e.g. "formula: C3H8") or the parts of a mixture');
  const options = { densityGcm3: density, state, ...(excitation !== undefined ? { meanExcitationEV: excitation } : {}) };
  if (formula) return compound(name, formula, options);
  const sum = parts.reduce((s, p) => s + p.massFraction, 0);
  if (Math.abs(sum - 1) > 0.01) throw msg.badMaterialFile(fileName, firstPartLine, `the mass fractions of the parts sum to ${Number(sum.toPrecision(4))}, not 1 (within 1 %); fix the fractions`);
  return mixture(name, parts, options);
}

function densityGcm3(value: string, file: string, line: number): number {
  const m = /^([0-9.eE+-]+)\s*(g\s*\/\s*cm(?:3|³)|kg\s*\/\s*m(?:3|³))$/.exec(value);
  const x = m ? Number(m[1]) : NaN;
  if (!m || !(x > 0) || !Number.isFinite(x)) throw msg.badMaterialFile(file, line, `density must be a positive number with a unit, e.g. "density: 1.56e-3 g/cm3" or "1.56 kg/m3", found ${JSON.stringify(value)}`);
  return m[2].startsWith('kg') ? x / 1000 : x;
}

function parseFormula(value: string, file: string, line: number): Record<string, number> {
  const out: Record<string, number> = {};
  const re = /([A-Z][a-z]?)(\d*(?:\.\d+)?)/gy;
  let m: RegExpExecArray | null;
  let used = 0;
  while ((m = re.exec(value)) !== null && m[0] !== '') {
    if (!ELEMENTS[m[1]]) throw msg.badMaterialFile(file, line, `unknown element "${m[1]}" in formula ${JSON.stringify(value)}; known: ${Object.keys(ELEMENTS).join(', ')}`);
    out[m[1]] = (out[m[1]] ?? 0) + (m[2] ? Number(m[2]) : 1);
    used = re.lastIndex;
  }
  if (used !== value.length || used === 0) throw msg.badMaterialFile(file, line, `cannot read the formula ${JSON.stringify(value)}; write element symbols with counts, e.g. "C3H8" or "H2O"`);
  return out;
}

/** An element symbol, a table material name, or a formula (built at the density of its parts' sum — only composition matters). */
function constituent(text: string, file: string, line: number): MixturePart['of'] {
  if (ELEMENTS[text]) return text;
  try {
    return tableMaterial(text);
  } catch {
    if (/^([A-Z][a-z]?\d*(?:\.\d+)?)+$/.test(text)) return compound(text.toLowerCase(), parseFormula(text, file, line), { densityGcm3: 1 });
    throw msg.badMaterialFile(file, line, `"${text}" is neither an element symbol, a table material nor a formula; use e.g. "Ar", "argon-gas" or "CH4"`);
  }
}
