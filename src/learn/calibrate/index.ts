/** calibrate: tight-binding parameters fitted to reference bands. Re-exports only. */
export * from './referenceBands.ts';
export * from './modelParameters.ts';
export * from './parametricBands.ts';
export * from './levenbergMarquardt.ts';
export * from './uncertainty.ts';
export * from './bandMatch.ts';
export * from './bandWeights.ts';
export * from './referenceChecks.ts';
export * from './problem.ts';
export * from './calibrate.ts';
export * from './starts.ts';
