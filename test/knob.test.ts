/** Notebook knobs (lib/knob.ts): kinds read from the default, supplied text checked against it. */
import { afterEach, describe, expect, it } from 'vitest';
import { SagittaError } from '../lib/errors.js';
import { knob, knobKind, knobSnapshot, readKnobValue, supplyKnobs } from '../lib/knob.js';

function codeOf(f: () => unknown): string | undefined {
  try {
    f();
  } catch (err) {
    return err instanceof SagittaError ? err.code : String(err);
  }
  return undefined;
}

afterEach(() => supplyKnobs(new Map()));

describe('knob', () => {
  it('is its default when nothing is supplied; a quantity comes back in the internal unit (1 T = 10 kG, 1 GeV/c = 1000 MeV/c; common practice)', () => {
    expect(knob('field', '1.5 T')).toBe(1.5);
    expect(knob('pMin', '350 MeV/c')).toBeCloseTo(0.35, 12);
    expect(knob('shownEvent', 201)).toBe(201);
    expect(knob('file', 'data/hits.csv')).toBe('data/hits.csv');
    expect(knob('window', [0, 2])).toEqual([0, 2]);
    expect(knobSnapshot().map((k) => [k.name, k.kind, k.supplied])).toEqual([
      ['field', 'quantity', false], ['pMin', 'quantity', false], ['shownEvent', 'number', false], ['file', 'text', false], ['window', 'list', false],
    ]);
  });

  it('takes a supplied value of the same kind and dimension, in any unit of it', () => {
    supplyKnobs(new Map([['field', '12 kG'], ['shownEvent', '7'], ['window', '[1, 5]'], ['on', 'false']]));
    expect(knob('field', '1.5 T')).toBeCloseTo(1.2, 12);
    expect(knob('shownEvent', 201)).toBe(7);
    expect(knob('window', [0, 2])).toEqual([1, 5]);
    expect(knob('on', true)).toBe(false);
    expect(knobSnapshot()[0]).toMatchObject({ name: 'field', valueText: '12 kG', defaultText: '1.5 T', supplied: true, dimension: 'field', internalUnit: 'T' });
  });

  it('refuses (BAD_KNOB) a value without the unit, of another dimension, of the wrong kind or length', () => {
    for (const [defaultValue, text] of [['1.5 T', '1.2'], ['1.5 T', '2 m'], [201, '1.2 T'], [true, 'yes'], [[0, 2], '[0, 1, 2]'], [[0, 2], '["a", 2]']] as const) {
      expect(codeOf(() => readKnobValue('k', defaultValue, text))).toBe('BAD_KNOB');
    }
  });

  it('refuses bad names, defaults of no kind, unknown units and a second declaration with another default', () => {
    expect(codeOf(() => knob('__proto__', 1))).toBe('BAD_KNOB');
    expect(codeOf(() => knob('2fast', 1))).toBe('BAD_KNOB');
    expect(codeOf(() => knobKind('x', Number.NaN))).toBe('BAD_KNOB');
    expect(codeOf(() => knobKind('x', '2 furlongs'))).toBe('BAD_KNOB');
    expect(knobKind('x', '12')).toBe('text');
    knob('twice', 1);
    expect(codeOf(() => knob('twice', 2))).toBe('BAD_KNOB');
    expect(knob('twice', 1)).toBe(1);
  });
});
