/**
 * One section job as the CLI, the service's worker thread and the browser worker run it: a
 * section document, or a scenario to build one from, solved and (optionally) compared with its
 * options. Plain JSON in, plain JSON out, so it crosses a worker boundary unchanged.
 */
import { DrydigError, parseScenario, parseSection, summariseIssues } from '../schema';
import { buildSectionFromScenario, type SectionFromScenarioOptions } from './section-from-scenario';
import { compareSectionOptions, type CompareSectionOptions, type SectionComparison } from './compare-section-options';
import { sectionFlow, solveSectionDocument, type SectionResult } from './solve-section';

export interface SectionJob {
  /** A section document (format drydig.section). */
  section?: unknown;
  /** Or a scenario (format drydig.scenario) to build the section from. */
  scenario?: unknown;
  /** How to build it from the scenario. */
  fromScenario?: Omit<SectionFromScenarioOptions, 'scenario'>;
  /** Solve the options side by side too (false: no; true: defaults). */
  compare?: boolean | CompareSectionOptions;
  /** Include the flow net. Default true. */
  flowNet?: boolean;
  /** The plan design's total flow, m³/s, shown beside flow per metre × perimeter. */
  planTotalRate_m3_s?: number;
}

export interface SectionJobOptions {
  /**
   * Where JSON pointers start: 'request' (default) names fields from a request body's root
   * (`/section/walls/0/toe_m`); 'document' from the file's own root (`/walls/0/toe_m`).
   */
  pointers?: 'request' | 'document';
}

export interface SectionJobAnswer extends SectionResult {
  section: unknown;
  fromScenario?: { excavationId: string; perimeter_m: number; halfWidth_m: number; flowTimesPerimeter_m3_s: number; planTotalRate_m3_s: number | null; assumptions: string[] };
  comparison?: SectionComparison;
}

/** Runs a section job; bad input throws a DrydigError naming the field (pointers from the job's root). */
export function runSectionJob(job: SectionJob, options: SectionJobOptions = {}): SectionJobAnswer {
  const inRequest = options.pointers !== 'document';
  if ((job.section === undefined) === (job.scenario === undefined)) {
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', '/section: give either a section document or a scenario to build one from', [{ path: '/section', message: 'give section or scenario (one of them)' }]);
  }
  let doc;
  let from: SectionJobAnswer['fromScenario'];
  if (job.scenario !== undefined) {
    const scenario = parseScenario(job.scenario, inRequest ? '/scenario' : '');
    if (scenario.excavations.length === 0) throw new DrydigError('DRYDIG_ERR_INVALID_SCENARIO', '/scenario/excavations: the scenario has no excavation to take a section through', [{ path: '/scenario/excavations', message: 'needs an excavation' }]);
    const id = job.fromScenario?.excavationId;
    if (id !== undefined && !scenario.excavations.some((e) => e.id === id)) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `/fromScenario/excavationId: no excavation "${id}" in the scenario`, [{ path: '/fromScenario/excavationId', message: 'no such excavation' }]);
    const built = buildSectionFromScenario({ ...job.fromScenario, scenario });
    const result = parseSectionChecked(built.section, '/fromScenario');
    doc = result;
    from = { excavationId: built.excavationId, perimeter_m: built.perimeter_m, halfWidth_m: built.halfWidth_m, flowTimesPerimeter_m3_s: 0, planTotalRate_m3_s: job.planTotalRate_m3_s ?? null, assumptions: built.assumptions };
  } else {
    doc = parseSection(job.section, inRequest ? '/section' : '');
  }
  const result = solveSectionDocument(doc, { flowNet: job.flowNet ?? true });
  const answer: SectionJobAnswer = { ...result, section: doc };
  if (from) answer.fromScenario = { ...from, flowTimesPerimeter_m3_s: sectionFlow(result) * from.perimeter_m };
  if (job.compare) answer.comparison = compareSectionOptions(doc, job.compare === true ? {} : job.compare);
  return answer;
}

/** A section built from a scenario and options that cannot hold (e.g. a toe below the base) is an error of those options. */
function parseSectionChecked(doc: unknown, prefix: string) {
  try {
    return parseSection(doc);
  } catch (error) {
    if (!(error instanceof DrydigError)) throw error;
    const issues = error.issues.map((i) => ({ path: `${prefix}${i.path.replace(/^\/walls\/0\/toe_m$/, '/toe_m')}`, message: i.message }));
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', summariseIssues(issues), issues);
  }
}
