/**
 * JSON Schema (draft-07) of the Sagitta scenario file, format tag "sagitta-scenario/1".
 * Quantities are text with a unit ("1.5 T", "80 cm", "600 MeV/c", "3 mrad"), read by lib/units
 * after the schema check; plain numbers are dimensionless (weights, fractions, counts).
 * `sagitta simulate --schema` prints this schema.
 */
const quantity = { type: 'string', pattern: '^\\s*[-+]?(\\d+\\.?\\d*|\\.\\d+)([eE][-+]?\\d+)?\\s*[A-Za-zµμ]', description: 'e.g. "80 cm"' };
const vector3 = { type: 'array', items: quantity, minItems: 3, maxItems: 3 };
const direction = { type: 'array', items: { type: 'number' }, minItems: 3, maxItems: 3, description: 'a direction [dx, dy, dz]; need not be normalised' };
const events = { type: 'integer', minimum: 0, maximum: 1_000_000 };

const beamLike = {
  events,
  momentum: { ...quantity, description: 'mean momentum, e.g. "600 MeV/c"' },
  momentumSpread: { type: 'number', minimum: 0, maximum: 1, description: 'relative Gaussian σ of |p| (0.02 = 2 %)' },
  origin: { ...vector3, description: 'start point [x, y, z], e.g. ["-59 cm", "0 cm", "0 cm"]; inside the chamber' },
  direction,
  spot: { ...quantity, description: 'Gaussian σ of the start point across the beam' },
  divergence: { ...quantity, description: 'Gaussian σ of the projected direction, e.g. "3 mrad"' },
};

const speciesField = {
  oneOf: [
    { type: 'string' },
    { type: 'object', minProperties: 1, additionalProperties: { type: 'number', exclusiveMinimum: 0 } },
  ],
  description: 'one species ("pi-") or weights ({"pi-": 0.7, "proton": 0.3})',
};

export const SCENARIO_SCHEMA = Object.freeze({
  $schema: 'http://json-schema.org/draft-07/schema#',
  $id: 'https://sagitta.invalid/schema/scenario-1.json',
  title: 'Sagitta chamber scenario',
  type: 'object',
  additionalProperties: false,
  required: ['format', 'name', 'chamber', 'measurement', 'sources'],
  properties: {
    $schema: { type: 'string' },
    format: { const: 'sagitta-scenario/1' },
    name: { type: 'string', minLength: 1, pattern: '^[A-Za-z0-9._-]+$', description: 'used in outputs and file names' },
    description: { type: 'string' },
    chamber: {
      type: 'object',
      additionalProperties: false,
      required: ['size', 'medium', 'field'],
      properties: {
        size: { ...vector3, description: 'full box sizes [x, y, z]; the box is centred on the origin, +y is up' },
        medium: { type: 'string', description: 'a lib/matter material name ("liquid hydrogen", "argon gas", …) or "vacuum"' },
        field: { oneOf: [quantity, vector3], description: 'field along z ("1.5 T") or [Bx, By, Bz]' },
      },
    },
    transport: {
      type: 'object',
      additionalProperties: false,
      properties: {
        energyLoss: { enum: ['mean', 'straggling', 'off'] },
        scattering: { type: 'boolean' },
        maxStep: quantity,
        maxPath: quantity,
        deltaRaysAbove: { ...quantity, description: 'make knock-on electrons above this kinetic energy, e.g. "2 MeV"; omit for none' },
        decaysInFlight: { type: 'boolean', description: 'charged pions decay in flight (π → μν) with their lifetime; default true' },
      },
    },
    measurement: {
      type: 'object',
      additionalProperties: false,
      required: ['resolution'],
      properties: {
        spacing: { ...quantity, description: 'a hit every this much path length' },
        planes: {
          type: 'object',
          additionalProperties: false,
          required: ['axis'],
          properties: {
            axis: { enum: ['x', 'y', 'z'] },
            at: { type: 'array', items: quantity, minItems: 1 },
            from: quantity,
            to: quantity,
            count: { type: 'integer', minimum: 1, maximum: 10000 },
          },
        },
        resolution: {
          oneOf: [
            quantity,
            { type: 'object', additionalProperties: false, required: ['x', 'y', 'z'], properties: { x: quantity, y: quantity, z: quantity } },
          ],
        },
        efficiency: { type: 'number', minimum: 0, maximum: 1 },
        noiseHitsPerEvent: { type: 'number', minimum: 0, maximum: 1000 },
      },
    },
    sources: {
      type: 'array',
      minItems: 1,
      items: {
        type: 'object',
        required: ['type'],
        properties: { type: { enum: ['beam', 'neutral-decay', 'burst', 'cosmic', 'stopping'] } },
        allOf: [
          {
            if: { properties: { type: { const: 'beam' } } },
            then: {
              additionalProperties: false,
              required: ['type', 'events', 'species', 'momentum', 'origin', 'direction'],
              properties: {
                type: {},
                ...beamLike,
                species: speciesField,
              },
            },
          },
          {
            if: { properties: { type: { const: 'neutral-decay' } } },
            then: {
              additionalProperties: false,
              required: ['type', 'events', 'parent', 'momentum', 'origin', 'direction'],
              properties: { type: {}, ...beamLike, parent: { enum: ['K0S', 'Lambda'] } },
            },
          },
          {
            if: { properties: { type: { const: 'burst' } } },
            then: {
              additionalProperties: false,
              required: ['type', 'events', 'multiplicity', 'species', 'ptRange', 'origin'],
              properties: {
                type: {},
                events,
                multiplicity: { type: 'array', items: { type: 'integer', minimum: 1, maximum: 500 }, minItems: 2, maxItems: 2, description: 'particles per event [fewest, most], drawn uniformly' },
                species: speciesField,
                ptRange: { type: 'array', items: quantity, minItems: 2, maxItems: 2, description: 'transverse momentum (across z) range, drawn log-uniformly, e.g. ["0.1 GeV/c", "2 GeV/c"]' },
                tanLambdaRange: { type: 'array', items: { type: 'number', minimum: -100, maximum: 100 }, minItems: 2, maxItems: 2, description: 'dip tan λ = p_z/p_T range, drawn uniformly; default [0, 0]' },
                origin: beamLike.origin,
                spot: { ...quantity, description: 'Gaussian σ of the common start point in x, y and z' },
              },
            },
          },
          {
            if: { properties: { type: { const: 'cosmic' } } },
            then: {
              additionalProperties: false,
              required: ['type', 'events', 'momentumRange'],
              properties: {
                type: {},
                events,
                momentumRange: { type: 'array', items: quantity, minItems: 2, maxItems: 2 },
                spectralIndex: { type: 'number', minimum: 0, maximum: 10 },
                chargeRatio: { type: 'number', exclusiveMinimum: 0 },
              },
            },
          },
          {
            if: { properties: { type: { const: 'stopping' } } },
            then: {
              additionalProperties: false,
              required: ['type', 'events', 'species', 'depth', 'origin', 'direction'],
              properties: {
                type: {},
                events,
                species: { type: 'string', description: 'a charged species: "mu+", "pi+", "proton", …; stopped muons and π⁺ decay at rest' },
                depth: { type: 'array', items: quantity, minItems: 2, maxItems: 2, description: 'path length range in which the muons stop' },
                origin: beamLike.origin,
                direction,
                spot: beamLike.spot,
                divergence: beamLike.divergence,
              },
            },
          },
        ],
      },
    },
  },
});
