export * from './consolidation-settlement';
export * from './angular-distortion';
export * from './receptor-points';
export * from './receptor-result';
export * from './assess-receptors';
export * from './receptor-wording';
