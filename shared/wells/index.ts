export * from './theis-well-function';
export * from './bessel-k0';
export * from './hantush-well-function';
export * from './well-function-accuracy';
export * from './partial-penetration-correction';
