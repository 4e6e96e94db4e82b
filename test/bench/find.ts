/**
 * Track-finding benchmark (run by `npm run bench`, or directly: `node --import tsx test/bench/find.ts`).
 * Target from the track-finding issue: ≥ 2 000 events/s of 15 tracks on one core. Events as in
 * the finding tests: a burst of 15 muons with p_T 0.1–2 GeV/c from one spot, argon gas, 1 T, a
 * hit every 10 mm with 300 µm errors, 10 % noise hits. Inputs are simulated before the timed
 * body; the median of several repetitions is reported.
 */
import { performance } from 'node:perf_hooks';
import { findTracks } from '../../lib/find/findTracks.js';
import { withNoiseHits } from '../../lib/fitlab/withNoiseHits.js';
import { parseScenario, seededRandom, simulateChamber } from '../../lib/simulate/index.js';

const EVENTS = 200;
const config = parseScenario(JSON.stringify({
  format: 'sagitta-scenario/1', name: 'bench-find',
  chamber: { size: ['120 cm', '120 cm', '100 cm'], medium: 'argon-gas', field: '1 T' },
  measurement: { spacing: '10 mm', resolution: '300 um' },
  sources: [{ type: 'burst', events: EVENTS, multiplicity: [15, 15], species: { 'mu-': 1, 'mu+': 1 }, ptRange: ['0.1 GeV/c', '2 GeV/c'], tanLambdaRange: [-1, 1], origin: ['0 cm', '0 cm', '0 cm'], spot: '1 mm' }],
}));
const hits = withNoiseHits(simulateChamber(config, 1).hits, 0.1, config.chamber, seededRandom(2, 'bench noise'));

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[s.length >> 1];
}

const options = { originM: [0, 0, 0] as [number, number, number] };
for (let w = 0; w < 3; w++) findTracks(hits, options);
const times: number[] = [];
let found = 0;
for (let r = 0; r < 7; r++) {
  const t0 = performance.now();
  found = findTracks(hits, options).count;
  times.push(performance.now() - t0);
}
const perSecond = EVENTS / (median(times) / 1000);
const target = 2000;
process.stdout.write(`  findTracks, ${EVENTS} events × 15 tracks, ${(hits.length / EVENTS).toFixed(0)} hits/event (10 % noise), ${found} found`.padEnd(80) +
  ` ${perSecond.toFixed(0).padStart(6)} events/s  ${((hits.length / EVENTS) * perSecond / 1e6).toFixed(2)} M hits/s  (target ≥ ${target}${perSecond >= target ? '' : ': MISSED'})\n`);
