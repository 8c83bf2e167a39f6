export * from './run-evaluation';
export * from './flag-runs';
export * from './result-cautions';
