import { checkKnobName, msg } from '../../lib/internal.js';

/**
 * Reads `--set name=value` arguments into knob values, as text: each is checked against the
 * knob the notebook declares (its type and unit) before any cell runs (findKnobs.ts). A Map, so
 * no name (`__proto__` included) can reach an object's prototype.
 * @example parseSetArguments(['field=1.2 T', 'shownEvent=7']) // Map { 'field' => '1.2 T', 'shownEvent' => '7' }
 */
export function parseSetArguments(items: readonly string[]): Map<string, string> {
  const out = new Map<string, string>();
  for (const item of items) {
    const eq = item.indexOf('=');
    if (eq < 0) throw msg.badArgument('--set', item, 'name=value naming a knob of the notebook, e.g. --set field="1.2 T"');
    const name = item.slice(0, eq);
    try {
      checkKnobName(name);
    } catch {
      throw msg.badArgument('--set', item, 'name=value where the name is a knob name (letters, digits and _), e.g. --set field="1.2 T"');
    }
    if (out.has(name)) throw msg.badArgument('--set', item, `one value per knob; ${name} was already set to ${JSON.stringify(out.get(name))}`);
    out.set(name, item.slice(eq + 1));
  }
  return out;
}
