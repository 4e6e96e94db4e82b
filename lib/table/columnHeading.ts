/**
 * Column headings from Sagitta's snake_case output names, which end in their unit
 * (`pt_GeV_c`, `csda_range_g_cm2`, `sigma_mass_pipi_MeV`): the quantity as a reader writes it
 * and the unit apart, so a table header can show both.
 */

/** Unit suffixes, longest first, with how they are written. */
const UNITS: readonly (readonly [string, string])[] = [
  ['_MeV_cm2_g', 'MeV cm²/g'], ['_keV_um', 'keV/µm'], ['_GeV_c2', 'GeV/c²'], ['_MeV_c2', 'MeV/c²'],
  ['_g_cm2', 'g/cm²'], ['_g_cm3', 'g/cm³'], ['_GeV_c', 'GeV/c'], ['_MeV_c', 'MeV/c'], ['_keV_c', 'keV/c'],
  ['_C_kg', 'C/kg'], ['_per_m', '1/m'], ['_mrad', 'mrad'], ['_GeV', 'GeV'], ['_MeV', 'MeV'], ['_keV', 'keV'],
  ['_eV', 'eV'], ['_rad', 'rad'], ['_deg', '°'], ['_cm', 'cm'], ['_mm', 'mm'], ['_um', 'µm'], ['_ns', 'ns'],
  ['_ps', 'ps'], ['_us', 'µs'], ['_kV', 'kV'], ['_V', 'V'], ['_mA', 'mA'], ['_A', 'A'], ['_mT', 'mT'],
  ['_T', 'T'], ['_m', 'm'], ['_s', 's'], ['_u', 'u'],
];

/** Words of a name written as the quantity's symbol (HTML with sub- and superscripts). */
const SYMBOLS: Readonly<Record<string, string>> = {
  pt: 'p<sub>T</sub>', phi0: 'φ<sub>0</sub>', d0: 'd<sub>0</sub>', z0: 'z<sub>0</sub>', chi2: 'χ²', kappa: 'κ',
  sigma: 'σ', lambda: 'λ', tan: 'tan', alpha: 'α', qt: 'q<sub>T</sub>', pipi: 'ππ', ppi: 'pπ', pip: 'πp',
  ee: 'ee', n: 'n', k0s: 'K⁰<sub>S</sub>', dedx: 'dE/dx', mq: 'm/q',
};

/** A heading: the quantity (HTML and plain text) and its unit ('' when the name carries none). */
export interface ColumnHeading {
  readonly html: string;
  readonly text: string;
  readonly unit: string;
}

function escape(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/**
 * The heading of a column named `name`.
 * @example columnHeading('sigma_pt_GeV_c') // { html: 'σ p<sub>T</sub>', text: 'σ pT', unit: 'GeV/c' }
 */
export function columnHeading(name: string): ColumnHeading {
  let stem = name, unit = '';
  for (const [suffix, written] of UNITS) {
    if (stem.endsWith(suffix) && stem.length > suffix.length) { stem = stem.slice(0, -suffix.length); unit = written; break; }
  }
  if (stem === 'n_hits') return { html: 'hits', text: 'hits', unit };
  if (stem === 'm_over_q') return { html: 'm/q', text: 'm/q', unit };
  const words = stem.split('_').filter((w) => w !== '');
  const html = words.map((w) => SYMBOLS[w] ?? escape(w)).join(' ');
  return { html, text: html.replace(/<\/?su[bp]>/g, ''), unit };
}

/** The name of the column holding the 1σ error of `name`, by Sagitta's naming (`sigma_<name>`). */
export function errorColumnName(name: string): string {
  return `sigma_${name}`;
}
