export * from './floor-options';
export * from './floor-profile';
export * from './floor-checks';
export * from './excavation-floor';
export * from './floor-timeline';
export * from './floor-wording';
