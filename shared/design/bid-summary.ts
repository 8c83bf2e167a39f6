/**
 * The pump and bid summary: flows (with the safety factor and, for steady designs, the initial
 * allowance), pump heads, power, duty and standby pumps, energy, discharge volume, costs and
 * quantities. Heads and powers follow `pump-sizing.ts`.
 */
import type { Scenario } from '../schema';
import type { ResolvedDesignOptions } from './design-options';
import type { DesignWellResult, PumpSummary } from './design-result';
import { pumpCounts, pumpPower, totalDynamicHead } from './pump-sizing';
import type { DesignWell } from './well-limits';

const SECONDS_PER_HOUR = 3600;

/**
 * Header length for well points: the wells chained nearest-neighbour; a gap over five times the
 * median spacing starts a new header run (it is not piped). Common practice, no single source.
 */
export function estimateHeaderLength(points: ReadonlyArray<readonly [number, number]>): number {
  const n = points.length;
  if (n < 2) return 0;
  const used = new Uint8Array(n);
  const steps: number[] = [];
  let current = 0;
  used[0] = 1;
  for (let k = 1; k < n; k++) {
    let best = -1;
    let bestD = Infinity;
    const [cx, cy] = points[current]!;
    for (let i = 0; i < n; i++) {
      if (used[i]) continue;
      const d = Math.hypot(points[i]![0] - cx, points[i]![1] - cy);
      if (d < bestD) {
        bestD = d;
        best = i;
      }
    }
    used[best] = 1;
    steps.push(bestD);
    current = best;
  }
  // Close the ring when the last well is about one spacing (≤ 1.5 × median) from the first (a ring main).
  const sorted = [...steps].sort((p, q) => p - q);
  const median = sorted[Math.floor(sorted.length / 2)]!;
  const closing = Math.hypot(points[current]![0] - points[0]![0], points[current]![1] - points[0]![1]);
  const limit = 5 * Math.max(median, 1e-9);
  return steps.filter((d) => d <= limit).reduce((s, d) => s + d, 0) + (n > 2 && closing <= 1.5 * median ? closing : 0);
}

export interface SummariseDesignOptions {
  scenario: Scenario;
  options: ResolvedDesignOptions;
  wells: DesignWell[];
  /** Filled in here: `head_m` of deep wells and ejectors. */
  wellResults: DesignWellResult[];
  rates: Float64Array;
  installed: Uint8Array;
}

/** Builds the pump and bid summary (and sets each deep well's head in `wellResults`). */
export function summariseDesign({ scenario, options, wells, wellResults, rates, installed }: SummariseDesignOptions): PumpSummary {
  const total = rates.reduce((s, q) => s + q, 0);
  const sf = options.safetyFactor;
  const steady = scenario.design.time_s === null;
  const used = wells.map((_, j) => installed[j] === 1 && rates[j]! > 0);

  let hydraulic_W = 0;
  let input_W = 0;
  let maxWellHead: number | null = null;
  const undersized: string[] = [];
  let deepPumps = 0;
  wells.forEach((w, j) => {
    if (!used[j] || w.kind === 'wellpoint') return;
    const r = wellResults[j]!;
    const head = totalDynamicHead({
      dischargeLevel_m: scenario.groundLevel_m,
      pumpingLevel_m: r.pumpingLevel_m,
      dischargeHead_m: options.dischargeHead_m,
      frictionAllowance_m: options.frictionAllowance_m,
    });
    r.head_m = head;
    maxWellHead = Math.max(maxWellHead ?? 0, head);
    const p = pumpPower({ rate_m3_s: rates[j]!, head_m: head, efficiency: options.efficiencyByKind[w.kind] });
    hydraulic_W += p.hydraulic_W;
    input_W += p.input_W;
    deepPumps++;
    if (rates[j]! * sf > options.pumpCapacity_m3_s) undersized.push(w.id);
  });

  // Well points share a header and its pump sets; the head is set by the lowest pumping level.
  const wpIdx = wells.map((_, j) => j).filter((j) => used[j] && wells[j]!.kind === 'wellpoint');
  const wpFlow = wpIdx.reduce((s, j) => s + rates[j]!, 0);
  let headerHead: number | null = null;
  if (wpIdx.length > 0) {
    const lowest = Math.min(...wpIdx.map((j) => wellResults[j]!.pumpingLevel_m));
    headerHead = totalDynamicHead({
      dischargeLevel_m: Math.max(options.headerLevel_m, scenario.groundLevel_m),
      pumpingLevel_m: lowest,
      dischargeHead_m: options.dischargeHead_m,
      frictionAllowance_m: options.frictionAllowance_m,
    });
    const p = pumpPower({ rate_m3_s: wpFlow, head_m: headerHead, efficiency: options.efficiencyByKind.wellpoint });
    hydraulic_W += p.hydraulic_W;
    input_W += p.input_W;
  }
  const headerPumps = pumpCounts({ flow_m3_s: wpFlow * sf, pumpCapacity_m3_s: options.pumpCapacity_m3_s, standbyRatio: options.standbyRatio });
  const deepStandby = deepPumps > 0 ? Math.max(1, Math.ceil(deepPumps * options.standbyRatio - 1e-9)) : 0;

  const duration = options.duration_s;
  const initialPeriod = steady ? Math.min(options.initialPeriod_s, duration) : 0;
  const initialExtra = steady ? options.initialRateFactor - 1 : 0;
  // Energy and volume: the computed rates over the duration, plus the initial allowance (steady).
  const volume = total * duration + total * initialExtra * initialPeriod;
  const energy_kWh = ((input_W / 1000) * (duration + initialExtra * initialPeriod)) / SECONDS_PER_HOUR;

  const byKind = { wellpoint: 0, deep: 0, ejector: 0 };
  let screen = 0;
  wells.forEach((w, j) => {
    if (!used[j]) return;
    byKind[w.kind]++;
    screen += Math.max(0, w.screenTop_m - w.screenBottom_m);
  });
  const nWells = byKind.wellpoint + byKind.deep + byKind.ejector;
  const header = estimateHeaderLength(wpIdx.map((j) => [wells[j]!.x, wells[j]!.y] as const));
  const energyCost = energy_kWh * options.energyPrice_per_kWh;
  const pumpedVolumeCost = volume * options.pumpedVolumeCost_per_m3;
  // One price per kind: the same wells the quantities count (idle wells are left out of both).
  const costByKind = { wellpoint: byKind.wellpoint * options.wellCostByKind.wellpoint, deep: byKind.deep * options.wellCostByKind.deep, ejector: byKind.ejector * options.wellCostByKind.ejector };
  const wellCost = costByKind.wellpoint + costByKind.deep + costByKind.ejector;
  const idleWellIds = wells.filter((_, j) => !used[j]).map((w) => w.id);

  return {
    totalRate_m3_s: total,
    designFlow_m3_s: total * sf,
    safetyFactor: sf,
    initialRate_m3_s: steady ? total * options.initialRateFactor : null,
    initialPeriod_s: steady ? initialPeriod : null,
    headerSystemHead_m: headerHead,
    maxWellHead_m: maxWellHead,
    hydraulicPower_kW: hydraulic_W / 1000,
    inputPower_kW: input_W / 1000,
    installedPower_kW: (input_W * sf) / 1000,
    pumpCapacity_m3_s: options.pumpCapacity_m3_s,
    dutyPumps: headerPumps.duty + deepPumps,
    standbyPumps: headerPumps.standby + deepStandby,
    undersizedPumpWellIds: undersized,
    duration_s: duration,
    energy_kWh,
    dischargeVolume_m3: volume,
    energyCost,
    pumpedVolumeCost,
    wellCost,
    totalCost: energyCost + pumpedVolumeCost + wellCost,
    quantities: { wells: nWells, wellsByKind: byKind, screen_m: screen, header_m: header },
    currency: options.currency,
    wellCostByKind: costByKind,
    efficiencyByKind: { ...options.efficiencyByKind },
    idleWellIds,
  };
}
