/** Synthetic pumping-test readings from known parameters (invented, for tests only), with seeded noise. */
import { hantushDrawdown, theisDrawdown, type TestReading } from '../../../shared/testing';
import { seededRandom } from '../../helpers/seeded-random';

export interface SyntheticOptions {
  rate_m3_s: number;
  transmissivity_m2_s: number;
  storativity: number;
  leakageFactor_m?: number;
  wells: Array<{ well: string; distance_m: number }>;
  /** Log-spaced times from..to, count readings per well. */
  from_s?: number;
  to_s?: number;
  count?: number;
  /** Standard deviation of Gaussian noise, m (0: exact). */
  noise_m?: number;
  seed?: number;
}

/** Gaussian from two uniforms (Box–Muller). */
function gaussian(random: () => number): number {
  const u = Math.max(random(), 1e-300);
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random());
}

export function syntheticReadings(o: SyntheticOptions): TestReading[] {
  const random = seededRandom(o.seed ?? 1);
  const from = o.from_s ?? 60;
  const to = o.to_s ?? 2e5;
  const count = o.count ?? 30;
  const out: TestReading[] = [];
  let line = 2;
  for (const { well, distance_m } of o.wells)
    for (let k = 0; k < count; k++) {
      const time_s = from * (to / from) ** (k / (count - 1));
      const exact =
        o.leakageFactor_m === undefined
          ? theisDrawdown(o.rate_m3_s, o.transmissivity_m2_s, o.storativity, distance_m, time_s)
          : hantushDrawdown(o.rate_m3_s, o.transmissivity_m2_s, o.storativity, o.leakageFactor_m, distance_m, time_s);
      out.push({ time_s, drawdown_m: exact + (o.noise_m ?? 0) * gaussian(random), well, distance_m, phase: 'pumping', rate_m3_s: o.rate_m3_s, line: line++ });
    }
  return out;
}
