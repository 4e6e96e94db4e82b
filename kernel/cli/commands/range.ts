import type { Command } from 'commander';
import { arealDensityGcm2, consumeWarnings, csdaRange, energyMeV, kinematicsFromKinetic, kineticEnergyFromRange, kineticFromMomentum, lengthMetres, massStoppingPower, type Material, material as lookupMaterial, momentumGeV, type Particle, particle as lookupParticle, rangeCutoffMeV, rangeMaxMeV, rangeTable, type SagittaWarning, stoppingRegime } from '../../../lib/index.js';
import { isElectronLike, msg, parseMaterialFile } from '../../../lib/internal.js';
import { existsSync, readFileSync } from 'node:fs';

export interface RangeCommandOptions {
  particle: string;
  material: string;
  materialFile?: string;
  energy?: string;
  momentum?: string;
  range?: string;
  table?: boolean;
  from?: string;
  to?: string;
  points: string;
  json?: boolean;
}

/** The caution printed with every range answer (help text, text output, JSON field). */
export const RANGE_CAUTION =
  'These are mean CSDA values for research and teaching, not for treatment planning or dosimetry: ' +
  'for clinical or radiation-protection use follow licensed medical-physics practice and the relevant standards and local codes.';

/** One row of the `range` answer; keys are the stable JSON names. */
export interface RangeRow {
  readonly kinetic_energy_MeV: number | null;
  readonly momentum_MeV: number | null;
  readonly beta: number | null;
  readonly gamma: number | null;
  readonly stopping_power_MeV_cm2_g: number | null;
  readonly stopping_power_MeV_cm: number | null;
  readonly csda_range_g_cm2: number | null;
  readonly csda_range_cm: number | null;
  /** Which formula serves this energy: fit, join, bethe, extrapolated (heavy particles) or electron. */
  readonly stopping_regime: string;
}

/** What each regime id means, for the text output and the help. */
export const REGIME_TEXT: Readonly<Record<string, string>> = Object.freeze({
  fit: 'ICRU 49 low-energy fit',
  join: 'join of the ICRU 49 fit and Bethe',
  bethe: 'Bethe with shell and Bloch corrections',
  extrapolated: 'extrapolated: no low-energy fit for this material (approximate, see warning)',
  electron: 'ICRU 37 collision + radiative approximation',
});

/**
 * `sagitta range`: CSDA range, stopping power and kinematics of a species in a material, either
 * from an energy/momentum, back from a range, or as a table over an energy grid.
 */
export function registerRange(program: Command): void {
  program
    .command('range')
    .description('CSDA range, stopping power, β, γ and momentum of a charged particle in a material (and back from a range)')
    .option('--particle <name>', 'particle: proton, pi+, pi-, mu-, mu+, K+, electron, positron, deuteron, alpha, …', 'proton')
    .option('--material <name>', 'material: water, liquid-hydrogen, hydrogen-gas, helium-gas, air, argon-gas, liquid-propane, neon-gas, liquid-neon, silicon, polystyrene, nuclear-emulsion', 'water')
    .option('--material-file <path>', 'a user compound or mixture from a material file (format: lib/matter/materialFile.ts; overrides --material)')
    .option('--energy <quantity>', 'kinetic energy, e.g. "100 MeV"')
    .option('--momentum <quantity>', 'momentum, e.g. "450 MeV/c"')
    .option('--range <quantity>', 'CSDA range to go back from: a length ("7 cm") or an areal density ("7 g/cm2")')
    .option('--table', 'print a table over a log-spaced energy grid (--from, --to, --points)')
    .option('--from <quantity>', 'lowest kinetic energy of the table, e.g. "1 MeV" (default: the validity cutoff)')
    .option('--to <quantity>', 'highest kinetic energy of the table, e.g. "1 GeV"', '1 GeV')
    .option('--points <n>', 'number of table rows', '25')
    .option('--json', 'print JSON (keys kinetic_energy_MeV, momentum_MeV, stopping_power_MeV_cm2_g, csda_range_g_cm2, …)')
    .addHelpText('after', `
Heavy particles: the ICRU 49 low-energy fits, Bethe with shell and Bloch corrections above,
and a smooth join between them (valid from 0 to βγ = 1000); materials without a fit are
extrapolated below the proton-equivalent 2 MeV and warned about. e±: the ICRU 37 collision
formula plus an approximate radiative term (10 keV – 10 GeV). Ranges integrate 1/S from zero
energy. Every answer names its regime (fit, join, bethe, extrapolated, electron). Outside the
validity range the command refuses instead of printing a number.

Material file (--material-file), one "key: value" a line, # comments:
  name: ar-ch4-90-10
  density: 1.56e-3 g/cm3
  state: gas
  part: argon-gas 0.884        (or instead of part lines: formula: C3H8)
  part: CH4 0.116
  excitation: 85.7 eV          (optional measured I)

Caution: ${RANGE_CAUTION}

Examples:
  sagitta range --particle proton --material water --energy "100 MeV"
  sagitta range --particle mu+ --material liquid-hydrogen --range "1.2 cm" --json
  sagitta range --particle proton --material silicon --table --from "1 MeV" --to "1 GeV" --points 13
  sagitta range --particle alpha --material-file my-gas.txt --energy "5.3 MeV"`)
    .action((options: RangeCommandOptions) => {
      const { stdout, warnings } = runRange(options);
      process.stdout.write(stdout);
      for (const w of warnings) process.stderr.write(`sagitta range: warning: ${w.message}\n`);
    });
}

const num = (x: number): number | null => (Number.isFinite(x) ? x : null);

function row(p: Particle, m: Material, kineticEnergyMeV: number, rangeGcm2?: number): RangeRow {
  const k = kinematicsFromKinetic(p, kineticEnergyMeV);
  const s = massStoppingPower(p, m, kineticEnergyMeV);
  const r = rangeGcm2 ?? csdaRange(p, m, kineticEnergyMeV);
  return {
    kinetic_energy_MeV: num(kineticEnergyMeV),
    momentum_MeV: num(k.momentumMeV),
    beta: num(k.beta),
    gamma: num(k.gamma),
    stopping_power_MeV_cm2_g: num(s),
    stopping_power_MeV_cm: num(s * m.densityGcm3),
    csda_range_g_cm2: num(r),
    csda_range_cm: num(r / m.densityGcm3),
    stopping_regime: isElectronLike(p) ? 'electron' : stoppingRegime(p, m, kineticEnergyMeV),
  };
}

/** Reads --range: an areal density ("7 g/cm2", "70 kg/m2") or any length, converted with the density. */
export function rangeGcm2FromText(text: string, m: Material): number {
  // Every mass-thickness unit names grams (g, mg, kg, ug); no length unit does.
  const unitPart = text.replace(/^[\s+\-\d.eE]*/, '');
  if (/g/i.test(unitPart)) return arealDensityGcm2(text, { what: '--range' });
  return lengthMetres(text, { what: '--range' }) * 100 * m.densityGcm3;
}

function validityText(p: Particle): string {
  return `${p.charge !== 0 && Math.abs(p.massMeV - 0.51099895) < 1e-6 ? Number(rangeCutoffMeV(p).toPrecision(3)) : 0}–${Number(rangeMaxMeV(p).toPrecision(3))} MeV for ${p.name}`;
}

/** Runs the command; returns what goes to stdout and the warnings (also used by tests). */
export function runRange(options: RangeCommandOptions): { stdout: string; warnings: SagittaWarning[] } {
  consumeWarnings();
  const p = lookupParticle(options.particle);
  if (p.charge === 0) throw msg.badArgument('--particle', options.particle, 'a charged particle');
  const m = options.materialFile !== undefined ? readMaterialFile(options.materialFile) : lookupMaterial(options.material);
  const given = [options.energy, options.momentum, options.range].filter((x) => x !== undefined).length;

  if (options.table) {
    if (given > 0) throw msg.badArgument('--table', 'with --energy/--momentum/--range', '--table alone, with --from, --to and --points');
    const points = Number(options.points);
    if (!Number.isInteger(points) || points < 2 || points > 100_000) throw msg.badArgument('--points', options.points, 'an integer from 2 to 100000');
    const fromMeV = options.from !== undefined ? energyMeV(options.from, { what: '--from' }) : rangeCutoffMeV(p);
    const toMeV = energyMeV(options.to ?? '1 GeV', { what: '--to' });
    const t = rangeTable(p, m, { fromMeV, toMeV, points });
    const rows: RangeRow[] = [];
    for (let i = 0; i < t.kineticEnergyMeV.length; i++) rows.push(row(p, m, t.kineticEnergyMeV[i], t.csdaRangeGcm2[i]));
    const warnings = consumeWarnings();
    if (options.json) {
      return { stdout: JSON.stringify({ particle: p.name, material: m.name, density_g_cm3: m.densityGcm3, caution: RANGE_CAUTION, rows }) + '\n', warnings };
    }
    return { stdout: formatTable(p, m, rows), warnings };
  }

  if (given !== 1) throw msg.badArgument('--energy/--momentum/--range', `${given} given`, 'exactly one of them (or --table)');
  let kineticMeV: number;
  let rangeGiven: number | undefined;
  if (options.energy !== undefined) {
    kineticMeV = energyMeV(options.energy, { what: '--energy' });
    if (!Number.isFinite(massStoppingPower(p, m, kineticMeV)) || !Number.isFinite(csdaRange(p, m, kineticMeV))) throw msg.outsideValidity('--energy', options.energy, validityText(p));
  } else if (options.momentum !== undefined) {
    kineticMeV = kineticFromMomentum(p, momentumGeV(options.momentum, { what: '--momentum' }) * 1000);
    if (!Number.isFinite(massStoppingPower(p, m, kineticMeV)) || !Number.isFinite(csdaRange(p, m, kineticMeV))) throw msg.outsideValidity('--momentum', options.momentum, validityText(p));
  } else {
    rangeGiven = rangeGcm2FromText(options.range as string, m);
    kineticMeV = kineticEnergyFromRange(p, m, rangeGiven);
    if (!Number.isFinite(kineticMeV)) throw msg.outsideValidity('--range', options.range as string, `of ranges for ${validityText(p)} in ${m.name}`);
  }
  consumeWarnings();
  const r = row(p, m, kineticMeV, rangeGiven);
  const warnings = consumeWarnings();
  if (options.json) {
    return { stdout: JSON.stringify({ particle: p.name, material: m.name, density_g_cm3: m.densityGcm3, ...r, caution: RANGE_CAUTION }) + '\n', warnings };
  }
  return { stdout: formatOne(p, m, r), warnings };
}

function readMaterialFile(path: string): Material {
  if (!existsSync(path)) throw msg.fileNotFound(path);
  return parseMaterialFile(readFileSync(path, 'utf8'), path);
}

const g = (x: number | null, digits = 5): string => (x === null ? 'n/a' : Number(x.toPrecision(digits)).toString());

function header(p: Particle, m: Material): string {
  return `${p.name} in ${m.name} (ρ = ${g(m.densityGcm3, 4)} g/cm³, I = ${g(m.meanExcitationEV, 4)} eV${m.approximate ? ', approximate material' : ''})`;
}

function formatOne(p: Particle, m: Material, r: RangeRow): string {
  return [
    header(p, m),
    `  kinetic energy   ${g(r.kinetic_energy_MeV)} MeV`,
    `  momentum         ${g(r.momentum_MeV)} MeV/c`,
    `  beta, gamma      ${g(r.beta)}, ${g(r.gamma)}`,
    `  stopping power   ${g(r.stopping_power_MeV_cm2_g)} MeV cm²/g  (${g(r.stopping_power_MeV_cm)} MeV/cm)`,
    `  CSDA range       ${g(r.csda_range_g_cm2)} g/cm²  (${g(r.csda_range_cm)} cm)`,
    `  regime           ${REGIME_TEXT[r.stopping_regime] ?? r.stopping_regime}`,
    `  caution: ${RANGE_CAUTION}`,
    '',
  ].join('\n');
}

function formatTable(p: Particle, m: Material, rows: readonly RangeRow[]): string {
  const cols: [string, keyof RangeRow][] = [
    ['T [MeV]', 'kinetic_energy_MeV'], ['p [MeV/c]', 'momentum_MeV'], ['beta', 'beta'],
    ['S [MeV cm2/g]', 'stopping_power_MeV_cm2_g'], ['R [g/cm2]', 'csda_range_g_cm2'], ['R [cm]', 'csda_range_cm'],
    ['regime', 'stopping_regime'],
  ];
  const cells = rows.map((r) => cols.map(([, k]) => (k === 'stopping_regime' ? r[k] : g(r[k] as number | null))));
  const widths = cols.map(([h], j) => Math.max(h.length, ...cells.map((c) => c[j].length)));
  const line = (xs: readonly string[]) => xs.map((x, j) => x.padStart(widths[j])).join('  ');
  return [header(p, m), line(cols.map(([h]) => h)), ...cells.map(line), `caution: ${RANGE_CAUTION}`, ''].join('\n');
}
