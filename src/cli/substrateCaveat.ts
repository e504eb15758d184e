/** What the substrate commands' numbers are, printed under their readable output. */
export const SUBSTRATE_CAVEAT =
  'Model estimates (tight binding, the electron-counting rule, a capacitor model of the interface; a lattice fit that ignores energetics), not predictions of which pattern grows or is stable: relax candidate structures on the metal with a higher-level method (density-functional theory and beyond) and check against experiment (STM, ARPES, photoemission).';
