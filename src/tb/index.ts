/** The tight-binding engine: re-exports only. */
export * from './params.ts';
export * from './slaterKoster.ts';
export * from './model.ts';
export * from './kspace.ts';
export * from './kspacePath.ts';
export * from './bands.ts';
export * from './meshSpectrum.ts';
export * from './erfc.ts';
export * from './fermi.ts';
export * from './fill.ts';
export { HermitianEigensolver } from './eigh.ts';
export { parseParameterFile, validateParameterObject, PARAMETER_LIMITS } from '../io/paramsFile.ts';
export * from './dos.ts';
export * from './dosTriangle.ts';
export * from './countingRule.ts';
export * from './sigmaBonding.ts';
export * from './ranking.ts';
export * from './meshDensity.ts';
