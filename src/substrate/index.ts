/** Metal substrates: presets, coincidence fits, electron transfer, the η–δ map. Re-exports only. */
export * from './substrates.ts';
export * from './stretch.ts';
export * from './coincidence.ts';
export * from './defaults.ts';
export * from './alignment.ts';
export * from './alignmentLimits.ts';
export * from './transfer.ts';
export * from './observed.ts';
export * from './dopingMap.ts';
