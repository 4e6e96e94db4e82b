/**
 * Makes the invented beam-tube and spectrometer series of a bench description (sagitta-bench/1)
 * from a seed: for every (voltage, coil current) of the tube the orbit radius an electron with
 * the CODATA 2018 e/m_e has in the mean field over its (off-axis) orbit, then each reading
 * smeared by its stated error; for the spectrometer, each ion's radius from its AME 2020 mass,
 * smeared likewise. Only for demo data.
 */
import { ELECTRON_CHARGE_TO_MASS_C_KG, ELECTRON_MASS_U, helmholtzField, isotope, lengthMetres, orbitFieldUniformity, quantity, sectorRadiusM, seededRandom } from 'sagitta-tracks';

interface Bench {
  readonly name: string;
  readonly tube: { coils: { turns: number; radius: string }; orbitCentreOffset: string; voltages: string[]; currents: string[]; errors: { voltage: string; current: string; radius: string } };
  readonly spectrometer: { voltage: string; field: string; ions: [string, number, number][]; errors: { radius: string } };
}

export function benchFiles(bench: Bench, seed: number): Record<string, string> {
  const rng = seededRandom(seed, `bench:${bench.name}`);
  const t = bench.tube;
  const coilRadius = lengthMetres(t.coils.radius);
  const offset = lengthMetres(t.orbitCentreOffset);
  const sV = quantity(t.errors.voltage, 'voltage'), sI = quantity(t.errors.current, 'current'), sR = lengthMetres(t.errors.radius);
  const tube = ['voltage_V,sigma_voltage_V,current_A,sigma_current_A,radius_m,sigma_radius_m'];
  for (const vt of t.voltages) {
    for (const it of t.currents) {
      const v = quantity(vt, 'voltage'), current = quantity(it, 'current');
      const coils = { turns: t.coils.turns, radiusM: coilRadius, currentA: current };
      // The orbit radius r solves r = √(2V/(e/m))/B(r): iterate with the mean field over the orbit.
      let r = Math.sqrt((2 * v) / ELECTRON_CHARGE_TO_MASS_C_KG) / helmholtzField(coils, 0, 0).bzT;
      for (let k = 0; k < 5; k++) r = Math.sqrt((2 * v) / ELECTRON_CHARGE_TO_MASS_C_KG) / orbitFieldUniformity(coils, r, offset, 72).meanT;
      tube.push([fixed(v + sV * rng.gaussian(), 1), fixed(sV, 1), fixed(current + sI * rng.gaussian(), 3), fixed(sI, 3), fixed(r + sR * rng.gaussian(), 4), fixed(sR, 4)].join(','));
    }
  }
  const s = bench.spectrometer;
  const volts = quantity(s.voltage, 'voltage'), field = quantity(s.field, 'field'), sRad = lengthMetres(s.errors.radius);
  const sector = ['peak,radius_m,sigma_radius_m,counts'];
  const truth = ['peak,isotope,charge'];
  // Peaks in order of radius, as a detector scan would list them.
  const peaks = s.ions.map(([name, q, counts]) => ({ name, q, counts, r: sectorRadiusM({ massU: isotope(name).massU - q * ELECTRON_MASS_U, charge: q, voltageV: volts, fieldT: field }) }))
    .sort((a, b) => a.r - b.r);
  peaks.forEach((p, i) => {
    sector.push([i + 1, fixed(p.r + sRad * rng.gaussian(), 6), fixed(sRad, 6), p.counts].join(','));
    truth.push([i + 1, p.name, p.q].join(','));
  });
  return {
    [`${bench.name}-tube.csv`]: tube.join('\n') + '\n',
    [`${bench.name}-sector.csv`]: sector.join('\n') + '\n',
    [`${bench.name}-sector-truth.csv`]: truth.join('\n') + '\n',
  };
}

/** Fixed decimals without "-0" (stable bytes). */
function fixed(value: number, decimals: number): string {
  const s = value.toFixed(decimals);
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
}
