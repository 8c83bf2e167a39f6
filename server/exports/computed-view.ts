/**
 * Everything computed from a stored revision that a view or export shows beside it: the plan
 * (levels, contours, checks, flags) and the design result. Live from the engine, or — once a link
 * has pinned the revision as the agreed plan — the snapshot frozen then, so the link keeps showing
 * the same numbers after an engine upgrade. The snapshot says which engine made it.
 */
import type { PlanResults } from '../../shared/exports';
import type { DesignResult } from '../../shared/design';
import type { RevisionRecord, ScenarioStore } from '../storage';
import { COMPUTED_BY, planResultsFor } from './computed-views';
import { designFor } from './design-for';

export interface ComputedView {
  results?: PlanResults;
  /** Why there are no plan results, in words (null when there are). */
  resultsError: string | null;
  design: DesignResult | null;
  designError: string | null;
  /** Program and version that computed this, e.g. "drydig 0.1.0". */
  computedBy: string;
  /** When the snapshot was frozen (a pinned link), or null for live results. */
  frozenAt: string | null;
}

interface SnapshotBody {
  results?: PlanResults;
  resultsError: string | null;
  design: DesignResult | null;
  designError: string | null;
}

async function computeLive(record: RevisionRecord): Promise<ComputedView> {
  // Both on the pool at once: a view waits for the longer of the two, not their sum.
  const [plan, design] = await Promise.all([planResultsFor(record.sha256, record.scenario), designFor(record.sha256, record.scenario)]);
  return {
    results: plan.results, resultsError: plan.error ?? null, design: design.design, designError: design.error,
    computedBy: COMPUTED_BY, frozenAt: null,
  };
}

/** Agreement of two rates, m³/s: to 0.5 % or 1e-6 m³/s (a design's rates applied, then saved). */
const sameRate = (a: number, b: number) => Math.abs(a - b) <= Math.max(1e-6, 5e-3 * Math.max(Math.abs(a), Math.abs(b)));

/**
 * True when the design's well rates are the revision's own (every active well; others 0): the one
 * agreed set of rates. A snapshot frozen before designs were checked on the stored rates may hold a
 * solver's design with other rates.
 */
export function designUsesRevisionRates(design: DesignResult, scenario: RevisionRecord['scenario']): boolean {
  if (design.rateSource === 'scenario') return true;
  const byId = new Map(design.wells.map((w) => [w.id, w.rate_m3_s]));
  return scenario.wells.every((w) => sameRate(byId.get(w.id) ?? 0, w.active === false ? 0 : (w.rate_m3_s ?? w.schedule?.[0]?.rate_m3_s ?? 0)));
}

/** The frozen snapshot of a revision if a link pinned it, else live results. */
export async function computedViewFor(store: ScenarioStore, record: RevisionRecord): Promise<ComputedView> {
  const snapshot = await store.getSnapshot(record.sha256);
  if (!snapshot) return computeLive(record);
  const body = JSON.parse(snapshot.body) as SnapshotBody;
  // One rate set: a frozen design for other rates than the revision's is not shown as its check.
  if (body.design && !designUsesRevisionRates(body.design, record.scenario))
    return {
      ...body, design: null, computedBy: snapshot.computedBy, frozenAt: snapshot.computedAt,
      designError: 'the design frozen with this revision was solved for other rates than the stored ones, so it is not shown; the rates below are the revision’s own',
    };
  return { ...body, computedBy: snapshot.computedBy, frozenAt: snapshot.computedAt };
}

/** Freezes the revision's computed results (first freeze wins; later calls return it). */
export async function freezeComputedView(store: ScenarioStore, record: RevisionRecord): Promise<ComputedView> {
  if (!(await store.getSnapshot(record.sha256))) {
    const live = await computeLive(record);
    const body: SnapshotBody = { results: live.results, resultsError: live.resultsError, design: live.design, designError: live.designError };
    await store.putSnapshot({ sha256: record.sha256, computedBy: live.computedBy, body: JSON.stringify(body) });
  }
  return computedViewFor(store, record);
}
