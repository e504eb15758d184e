/**
 * lacuna as a library: the pure computational core (no DOM, no file system). Re-exports only.
 *
 *   import { enumerateStructures, findSheetPreset, patternToSheet, TightBindingModel, fill } from 'lacuna';
 */
// Sheets and the triangular lattice.
export * from './lattice/triangular.ts';
export * from './lattice/hnf.ts';
export * from './lattice/sheet.ts';
export * from './lattice/pattern.ts';
export * from './lattice/neighbours.ts';
export * from './lattice/reduce.ts';
export * from './lattice/reducedCell.ts';
export * from './lattice/separation.ts';
export * from './lattice/recognise.ts';
export * from './lattice/geometry.ts';
export * from './lattice/holes.ts';
export * from './lattice/sheetSymmetry.ts';
export * from './lattice/presets.ts';
// Vacancy-pattern enumeration.
export * from './enumerate/index.ts';
// Tight binding.
export * from './tb/index.ts';
export { RealSymmetricEigensolver } from './linalg/eighReal.ts';
export { timeEigenvalues } from './linalg/eighBench.ts';
// The vacancy cluster expansion fitted to the user's energies, and its file.
export * from './learn/expansion/index.ts';
export * from './io/energiesFile.ts';
// Metal substrates: coincidence fits and electron transfer.
export * from './substrate/index.ts';
// Parameters fitted to the user's own reference bands (calibrate).
export * from './learn/calibrate/index.ts';
// Input and output.
export { ValidationError, invalid, fieldPath } from './validate/invalid.ts';
export { parseParameterFile } from './io/paramsFile.ts';
export * from './io/sheetFile.ts';
export * from './io/sheetLimits.ts';
export { parseKpointsText, parseKpointsObject } from './io/kpointsFile.ts';
export { parseReferenceBandsText, validateReferenceBands, REFERENCE_LIMITS } from './io/referenceBandsFile.ts';
export { sheetToCif } from './io/cif.ts';
export { sheetToXyz } from './io/xyz.ts';
export * from './io/sheetJson.ts';
// STM pictures: simulation (Tersoff–Hamann), measured-picture analysis and matching; picture files.
export * from './stm/index.ts';
export { encodeGreyPng, crc32, adler32 } from './io/png.ts';
export { toGrey8 } from './stm/grey.ts';
export { readPicture, MAX_PICTURE_PIXELS, MAX_PICTURE_SIDE, MIN_PICTURE_SIDE, type DecodedPicture } from './io/imageFile.ts';
