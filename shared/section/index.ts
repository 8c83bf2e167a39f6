/** Section seepage: the vertical-section engine (pure TypeScript; runs in the browser worker too). */
export * from './solve-section';
export * from './section-mesh';
export * from './graded-axis';
export * from './five-point-pcg';
export * from './assemble-section';
export * from './section-fields';
export * from './section-context';
export * from './floor-profile';
export * from './terzaghi-heave';
export * from './slab-uplift';
export * from './plug-uplift';
export * from './flow-net';
export * from './rectilinear-contours';
export * from './section-cautions';
export * from './section-from-scenario';
export * from './compare-section-options';
export * from './run-section-job';
