/** Scenario storage: the engine-neutral interface, the SQLite engine, tokens and change summaries. */
export * from './scenario-store';
export * from './sqlite-scenario-store';
export * from './open-scenario-store';
export * from './summarise-changes';
export * from './tokens';
export * from './account-store';
