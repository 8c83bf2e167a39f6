export * from './run-evaluation';
export * from './flag-runs';
export * from './result-cautions';
export * from './evaluation-in-bands';
