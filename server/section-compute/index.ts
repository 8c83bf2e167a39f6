export * from './section-solver';
