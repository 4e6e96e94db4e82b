import { parseScenario } from '../../lib/simulate/index.js';
import type { SimulationConfig } from '../../lib/simulate/index.js';

/**
 * The tracker of the finding targets (issue text): argon gas at 1 T, a hit every 10 mm of path,
 * 300 µm errors in x, y and z, no losses of hits. Sources: a burst of 10–20 muons with p_T
 * 0.1–2 GeV/c from one spot, or spiralling electrons of 5–50 MeV/c.
 */
export function trackerScenario(source: 'helices' | 'electrons', events: number): SimulationConfig {
  const sources = source === 'helices'
    ? [{ type: 'burst', events, multiplicity: [10, 20], species: { 'mu-': 1, 'mu+': 1 }, ptRange: ['0.1 GeV/c', '2 GeV/c'], tanLambdaRange: [-1, 1], origin: ['0 cm', '0 cm', '0 cm'], spot: '1 mm' }]
    : [{ type: 'burst', events, multiplicity: [3, 3], species: { electron: 1, positron: 1 }, ptRange: ['5 MeV/c', '50 MeV/c'], tanLambdaRange: [0.05, 1.5], origin: ['0 cm', '0 cm', '0 cm'], spot: '1 mm' }];
  return parseScenario(JSON.stringify({
    format: 'sagitta-scenario/1',
    name: `tracker-${source}`,
    chamber: { size: ['120 cm', '120 cm', '100 cm'], medium: 'argon-gas', field: '1 T' },
    measurement: { spacing: '10 mm', resolution: '300 um' },
    sources,
  }), `tracker-${source}`);
}
