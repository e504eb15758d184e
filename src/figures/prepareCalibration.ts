/**
 * The data of the calibration figure from a calibration result (src/learn/calibrate): pure, structured-cloneable.
 */
import type { CalibrationResult } from '../learn/calibrate/calibrate.ts';
import type { ReferenceBands } from '../learn/calibrate/referenceBands.ts';
import type { CalibrationFigureData } from './types.ts';

/** A step along the k-points longer than this many times the median step is a jump to another branch. */
const JUMP_FACTOR = 5;

/** Distance along a list of k-points (Å⁻¹, interleaved), not advanced over jumps; the indices after each jump. */
export function pathDistance(kpoints: Float64Array): { distance: Float64Array; breaks: number[] } {
  const count = kpoints.length / 2;
  const steps = new Float64Array(Math.max(0, count - 1));
  for (let k = 1; k < count; k++) steps[k - 1] = Math.hypot(kpoints[2 * k] - kpoints[2 * k - 2], kpoints[2 * k + 1] - kpoints[2 * k - 1]);
  const sorted = Float64Array.from(steps).sort();
  const median = sorted.length ? sorted[Math.floor(sorted.length / 2)] : 0;
  const distance = new Float64Array(count);
  const breaks: number[] = [];
  for (let k = 1; k < count; k++) {
    const jump = median > 0 && steps[k - 1] > JUMP_FACTOR * median;
    if (jump) breaks.push(k);
    distance[k] = distance[k - 1] + (jump ? 0 : steps[k - 1]);
  }
  return { distance, breaks };
}

/** Sheet `index` of a calibration, with the reference it was fitted to. */
export function prepareCalibration(result: CalibrationResult, index: number, reference: ReferenceBands): CalibrationFigureData {
  const sheet = result.sheets[index];
  const { distance, breaks } = pathDistance(reference.kpoints);
  const demo = reference.title?.startsWith('DEMO') ? 'DEMO reference bands: invented, not from any calculation' : undefined;
  const match = {
    modelFirst: sheet.modelBands[0] - 1,
    referenceFirst: sheet.referenceBands[0] - 1,
    count: sheet.modelBands[1] - sheet.modelBands[0] + 1,
  };
  return {
    sheetLabel: sheet.label,
    referenceLabel: sheet.referenceLabel,
    parameters: result.parameters.name,
    ...(demo ? { demo } : {}),
    count: reference.count,
    distance,
    labels: reference.labels ?? [],
    breaks,
    referenceBands: reference.bands,
    referenceEnergies: reference.energies,
    modelBands: sheet.modelBandCount,
    modelEnergies: sheet.modelEnergies,
    match,
    weights: sheet.weights,
    fermi: sheet.fermi,
    rms: sheet.rms,
    maxError: sheet.maxError,
    points: sheet.points,
    block: sheet.block,
  };
}
