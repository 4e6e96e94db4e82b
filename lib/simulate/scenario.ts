import { createRequire } from 'node:module';
import type { Ajv as AjvClass, ErrorObject } from 'ajv';
import { msg, SagittaError } from '../errors.js';
import { particle, type Particle } from '../particles.js';
import { recordInput } from '../provenance.js';
import { readInputFile } from '../io/readInputFile.js';
import { angleRad, fieldTesla, energyMeV, lengthMetres, momentumGeV } from '../units.js';
import { chamber, insideChamber, type Chamber } from './chamber.js';
import { chamberMedium } from '../matter/chamberMedium.js';
import { jsonPointerLines, withLines } from './jsonPointerLines.js';
import { VACUUM } from '../matter/medium.js';
import { SCENARIO_SCHEMA } from './scenarioSchema.js';
import type { MeasurementModel, SimulationConfig, Source, TransportSettings } from './simulate.js';
import { TRANSPORT_DEFAULTS, type Sampling } from './transportOptions.js';

/** Defaults of the optional scenario fields, in internal units (transport settings: the transport's own). */
export const SCENARIO_DEFAULTS = Object.freeze({
  energyLoss: TRANSPORT_DEFAULTS.energyLoss,
  scattering: TRANSPORT_DEFAULTS.scattering,
  maxStepM: TRANSPORT_DEFAULTS.maxStepM,
  maxPathM: TRANSPORT_DEFAULTS.maxPathM,
  efficiency: 1,
  noiseHitsPerEvent: 0,
  momentumSpread: 0,
  spotM: 0,
  divergenceRad: 0,
  spectralIndex: 2.7,
  chargeRatio: 1.27,
});

type Json = Record<string, unknown>;

// The schema validator (ajv) loads on the first scenario read, not with the library.
let validator: ReturnType<AjvClass['compile']> | undefined;
function validate(doc: unknown): readonly ErrorObject[] {
  if (validator === undefined) {
    const { Ajv } = createRequire(import.meta.url)('ajv') as typeof import('ajv');
    validator = new Ajv({ allErrors: true, strict: false, verbose: true }).compile(SCENARIO_SCHEMA);
  }
  return validator(doc) ? [] : (validator.errors ?? []);
}

/** One readable line per schema problem: "/sources/1/momentum: must be …". */
function describeErrors(errors: readonly ErrorObject[]): string {
  const lines: string[] = [];
  const seen = new Set<string>();
  for (const e of errors) {
    // 'if' and combinator summaries repeat what the specific errors already say.
    if (e.keyword === 'if' || e.keyword === 'oneOf' || e.keyword === 'allOf') continue;
    const at = e.instancePath === '' ? '(top level)' : e.instancePath;
    let text: string;
    if (e.keyword === 'additionalProperties') {
      text = `${at}: unknown field '${(e.params as { additionalProperty: string }).additionalProperty}' (check the spelling; see sagitta simulate --schema)`;
    } else if (e.keyword === 'enum') {
      text = `${at}: must be one of ${(e.params as { allowedValues: unknown[] }).allowedValues.map((v) => JSON.stringify(v)).join(', ')}`;
    } else if (e.keyword === 'const') {
      text = `${at}: must be ${JSON.stringify((e.params as { allowedValue: unknown }).allowedValue)}`;
    } else if (e.keyword === 'pattern') {
      const description = (e.parentSchema as { description?: string } | undefined)?.description;
      text = `${at}: ${JSON.stringify(e.data)} must be a number and a unit${description ? ` (${description})` : ''}`;
    } else if (e.keyword === 'required') {
      text = `${at}: missing field '${(e.params as { missingProperty: string }).missingProperty}'`;
    } else {
      text = `${at}: ${e.message ?? 'is not valid'}`;
    }
    if (!seen.has(text)) { seen.add(text); lines.push(text); }
  }
  const shown = lines.slice(0, 6);
  if (lines.length > shown.length) shown.push(`… and ${lines.length - shown.length} more`);
  return shown.join('; ');
}

/**
 * Reads, validates (JSON Schema, `SCENARIO_SCHEMA`) and resolves a scenario file into a
 * `SimulationConfig`. Every problem is a BAD_SCENARIO error naming the file, the JSON path of
 * the bad field and its line (e.g. "run.json: /sources/1/momentum (line 23): …"); bad JSON names
 * line and column.
 * Records the file in the provenance registry.
 * @example readScenario('notebooks/data/brindlemoor.scenario.json').sources.length
 */
export function readScenario(path: string): SimulationConfig {
  const bytes = readInputFile(path, 'the scenario file');
  recordInput(path, bytes);
  return parseScenario(bytes.toString('utf8'), path);
}

/** As `readScenario`, from text already in memory; `file` names it in messages. */
export function parseScenario(text: string, file = '(scenario)'): SimulationConfig {
  let doc: unknown;
  try {
    doc = JSON.parse(text);
  } catch (err) {
    throw msg.badScenario(file, `not valid JSON (${jsonErrorPlace(text, err)}); check commas, quotes and brackets`);
  }
  try {
    return resolveScenario(doc, file);
  } catch (err) {
    if (err instanceof SagittaError && err.code === 'BAD_SCENARIO') {
      throw new SagittaError('BAD_SCENARIO', withLines(err.message, jsonPointerLines(text)), err.where);
    }
    throw err;
  }
}

function jsonErrorPlace(text: string, err: unknown): string {
  const m = /position (\d+)/.exec(String((err as Error).message));
  if (!m) return String((err as Error).message);
  const pos = Number(m[1]);
  const before = text.slice(0, pos);
  const line = before.split('\n').length;
  const column = pos - before.lastIndexOf('\n');
  return `line ${line}, column ${column}`;
}

/** Validates a parsed scenario object and converts it to internal units. */
export function resolveScenario(doc: unknown, file = '(scenario)'): SimulationConfig {
  if (doc === null || typeof doc !== 'object' || Array.isArray(doc) || (doc as Json).format === undefined) {
    throw msg.badScenario(file, 'not a Sagitta scenario: the top level must be an object with "format": "sagitta-scenario/1" (see sagitta simulate --schema)');
  }
  const errors = validate(doc);
  if (errors.length > 0) throw msg.badScenario(file, describeErrors(errors));
  const d = doc as Json;
  const at = <T>(path: string, f: () => T): T => {
    try {
      return f();
    } catch (err) {
      if (err instanceof SagittaError) throw msg.badScenario(file, `${path}: ${err.message}`);
      throw err;
    }
  };
  const len = (text: unknown, path: string) => at(path, () => lengthMetres(String(text), { what: fieldName(path) }));
  const angle = (text: unknown, path: string) => at(path, () => angleRad(String(text), { what: fieldName(path) }));

  const ch = d.chamber as Json;
  const size = (ch.size as string[]).map((s, i) => len(s, `/chamber/size/${i}`)) as [number, number, number];
  const mediumName = String(ch.medium);
  const medium = mediumName.trim().toLowerCase() === 'vacuum' ? VACUUM : at('/chamber/medium', () => chamberMedium(mediumName));
  const fieldT: [number, number, number] = typeof ch.field === 'string'
    ? [0, 0, at('/chamber/field', () => fieldTesla(ch.field as string, { what: 'the field' }))]
    : (ch.field as string[]).map((s, i) => at(`/chamber/field/${i}`, () => fieldTesla(s, { what: 'the field' }))) as [number, number, number];
  const box: Chamber = at('/chamber/size', () => chamber({ sizeM: size, medium, fieldT }));

  const tr = (d.transport ?? {}) as Json;
  const transport: TransportSettings = {
    energyLoss: (tr.energyLoss as TransportSettings['energyLoss'] | undefined) ?? SCENARIO_DEFAULTS.energyLoss,
    scattering: (tr.scattering as boolean | undefined) ?? SCENARIO_DEFAULTS.scattering,
    maxStepM: tr.maxStep !== undefined ? positive(len(tr.maxStep, '/transport/maxStep'), '/transport/maxStep', file) : SCENARIO_DEFAULTS.maxStepM,
    maxPathM: tr.maxPath !== undefined ? positive(len(tr.maxPath, '/transport/maxPath'), '/transport/maxPath', file) : SCENARIO_DEFAULTS.maxPathM,
    decaysInFlight: (tr.decaysInFlight as boolean | undefined) ?? true,
    deltaRayMinMeV: tr.deltaRaysAbove !== undefined ? positive(at('/transport/deltaRaysAbove', () => energyMeV(tr.deltaRaysAbove as string, { what: 'the δ-ray threshold' })), '/transport/deltaRaysAbove', file) : 0,
  };

  const me = d.measurement as Json;
  let sampling: Sampling;
  if ((me.spacing === undefined) === (me.planes === undefined)) {
    throw msg.badScenario(file, "/measurement: give exactly one of 'spacing' (a hit every so much path) or 'planes'");
  }
  if (me.spacing !== undefined) {
    sampling = { kind: 'spacing', spacingM: positive(len(me.spacing, '/measurement/spacing'), '/measurement/spacing', file) };
  } else {
    const pl = me.planes as Json;
    const axis = ({ x: 0, y: 1, z: 2 } as const)[pl.axis as 'x' | 'y' | 'z'];
    let positions: number[];
    if (pl.at !== undefined) {
      if (pl.from !== undefined || pl.to !== undefined || pl.count !== undefined) throw msg.badScenario(file, "/measurement/planes: give either 'at' or 'from'/'to'/'count', not both");
      positions = (pl.at as string[]).map((s, i) => len(s, `/measurement/planes/at/${i}`));
    } else {
      if (pl.from === undefined || pl.to === undefined || pl.count === undefined) throw msg.badScenario(file, "/measurement/planes: give 'at' (a list) or all of 'from', 'to' and 'count'");
      const a = len(pl.from, '/measurement/planes/from');
      const b = len(pl.to, '/measurement/planes/to');
      const n = pl.count as number;
      positions = Array.from({ length: n }, (_, i) => (n === 1 ? a : a + ((b - a) * i) / (n - 1)));
    }
    sampling = { kind: 'planes', axis, positionsM: positions };
  }
  const res = me.resolution;
  const [sx, sy, sz] = typeof res === 'string'
    ? [len(res, '/measurement/resolution'), len(res, '/measurement/resolution'), len(res, '/measurement/resolution')]
    : (['x', 'y', 'z'] as const).map((k) => len((res as Json)[k], `/measurement/resolution/${k}`));
  const measurement: MeasurementModel = {
    sampling,
    sigmaXM: sx, sigmaYM: sy, sigmaZM: sz,
    efficiency: (me.efficiency as number | undefined) ?? SCENARIO_DEFAULTS.efficiency,
    noiseHitsPerEvent: (me.noiseHitsPerEvent as number | undefined) ?? SCENARIO_DEFAULTS.noiseHitsPerEvent,
  };

  const sources: Source[] = (d.sources as Json[]).map((s, i): Source => {
    const p = `/sources/${i}`;
    const vec = (v: unknown, name: string) => (v as string[]).map((t, k) => len(t, `${p}/${name}/${k}`)) as [number, number, number];
    const dir = (v: unknown): [number, number, number] => {
      const a = v as [number, number, number];
      if (Math.hypot(a[0], a[1], a[2]) === 0) throw msg.badScenario(file, `${p}/direction: [0, 0, 0] has no direction; give e.g. [1, 0, 0]`);
      return a;
    };
    const origin = (v: unknown) => {
      const o = vec(v, 'origin');
      if (!insideChamber(box, o[0], o[1], o[2])) throw msg.badScenario(file, `${p}/origin: the point lies outside the chamber (${size.map((x) => `${x} m`).join(' × ')} centred on the origin)`);
      return o;
    };
    const speciesOf = (v: unknown, path: string): { particle: Particle; weight: number }[] =>
      typeof v === 'string'
        ? [{ particle: at(`${path}/species`, () => particle(v)), weight: 1 }]
        : Object.entries(v as Record<string, number>).map(([name, w]) => ({ particle: at(`${path}/species/${name}`, () => particle(name)), weight: w }));
    const type = s.type as string;
    if (type === 'beam' || type === 'neutral-decay') {
      const species = type === 'neutral-decay'
        ? [{ particle: at(`${p}/parent`, () => particle(s.parent as string)), weight: 1 }]
        : speciesOf(s.species, p);
      return {
        kind: 'beam',
        events: s.events as number,
        species,
        momentumGeV: positive(at(`${p}/momentum`, () => momentumGeV(s.momentum as string, { what: 'the momentum' })), `${p}/momentum`, file),
        momentumSpread: (s.momentumSpread as number | undefined) ?? SCENARIO_DEFAULTS.momentumSpread,
        originM: origin(s.origin),
        direction: dir(s.direction),
        spotSigmaM: s.spot !== undefined ? len(s.spot, `${p}/spot`) : SCENARIO_DEFAULTS.spotM,
        divergenceRad: s.divergence !== undefined ? angle(s.divergence, `${p}/divergence`) : SCENARIO_DEFAULTS.divergenceRad,
        process: type === 'neutral-decay' ? 'neutral-beam' : 'beam',
      };
    }
    if (type === 'burst') {
      const [mLo, mHi] = s.multiplicity as [number, number];
      if (!(mHi >= mLo)) throw msg.badScenario(file, `${p}/multiplicity: need fewest ≤ most, got [${mLo}, ${mHi}]`);
      const [ptLo, ptHi] = (s.ptRange as string[]).map((t, k) => at(`${p}/ptRange/${k}`, () => momentumGeV(t, { what: 'the transverse momentum range' })));
      if (!(ptLo > 0 && ptHi >= ptLo)) throw msg.badScenario(file, `${p}/ptRange: need 0 < low ≤ high, got ${ptLo} and ${ptHi} GeV/c`);
      const [tlLo, tlHi] = (s.tanLambdaRange as [number, number] | undefined) ?? [0, 0];
      if (!(tlHi >= tlLo)) throw msg.badScenario(file, `${p}/tanLambdaRange: need low ≤ high, got [${tlLo}, ${tlHi}]`);
      return {
        kind: 'burst',
        events: s.events as number,
        multiplicity: [mLo, mHi],
        species: speciesOf(s.species, p),
        ptRangeGeV: [ptLo, ptHi],
        tanLambdaRange: [tlLo, tlHi],
        originM: origin(s.origin),
        spotSigmaM: s.spot !== undefined ? len(s.spot, `${p}/spot`) : SCENARIO_DEFAULTS.spotM,
      };
    }
    if (type === 'cosmic') {
      const [lo, hi] = (s.momentumRange as string[]).map((t, k) => at(`${p}/momentumRange/${k}`, () => momentumGeV(t, { what: 'the momentum range' })));
      if (!(lo > 0 && hi > lo)) throw msg.badScenario(file, `${p}/momentumRange: need 0 < low < high, got ${lo} and ${hi} GeV/c`);
      return {
        kind: 'cosmic',
        events: s.events as number,
        momentumMinGeV: lo,
        momentumMaxGeV: hi,
        spectralIndex: (s.spectralIndex as number | undefined) ?? SCENARIO_DEFAULTS.spectralIndex,
        chargeRatio: (s.chargeRatio as number | undefined) ?? SCENARIO_DEFAULTS.chargeRatio,
      };
    }
    const [lo, hi] = (s.depth as string[]).map((t, k) => len(t, `${p}/depth/${k}`));
    if (!(lo > 0 && hi >= lo)) throw msg.badScenario(file, `${p}/depth: need 0 < shallow ≤ deep, got ${lo} and ${hi} m`);
    if (medium === VACUUM) throw msg.badScenario(file, `${p}: stopping particles need a medium; the chamber holds vacuum`);
    const stoppingSpecies = at(`${p}/species`, () => particle(s.species as string));
    if (stoppingSpecies.charge === 0) throw msg.badScenario(file, `${p}/species: ${stoppingSpecies.name} is neutral and cannot be brought to rest by ionisation; use a charged species`);
    return {
      kind: 'stopping',
      events: s.events as number,
      species: stoppingSpecies,
      minDepthM: lo,
      maxDepthM: hi,
      originM: origin(s.origin),
      direction: dir(s.direction),
      spotSigmaM: s.spot !== undefined ? len(s.spot, `${p}/spot`) : SCENARIO_DEFAULTS.spotM,
      divergenceRad: s.divergence !== undefined ? angle(s.divergence, `${p}/divergence`) : SCENARIO_DEFAULTS.divergenceRad,
    };
  });

  return { name: d.name as string, chamber: box, transport, measurement, sources };
}

/** "the spacing" for "/measurement/spacing", "the size" for "/chamber/size/0". */
function fieldName(path: string): string {
  const parts = path.split('/').filter((x) => x !== '' && !/^\d+$/.test(x));
  return `the ${parts[parts.length - 1] ?? 'value'}`;
}

function positive(v: number, path: string, file: string): number {
  if (!(v > 0)) throw msg.badScenario(file, `${path}: must be positive, got ${v}`);
  return v;
}
