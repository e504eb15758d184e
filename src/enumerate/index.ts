export { canonicalForm, formatCanonical } from './canonical.ts';
export { countRowKeys, countStructures } from './count.ts';
export { enumerateStructures } from './enumerate.ts';
export { latticeOfVectors, periodLattice, primitivePattern } from './period.ts';
export { presetPhase } from './phase.ts';
export { buildQuotient, type SupercellQuotient } from './quotient.ts';
export { smithNormalForm, type SmithForm } from './smith.ts';
export { inequivalentSupercells, stabiliser, transformSupercell } from './supercells.ts';
export type { CountRow, EnumerateOptions, EnumerateProgress, Structure } from './types.ts';
