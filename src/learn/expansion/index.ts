export { clusterSet, neighbourShells, squaredLength, MAX_PAIR_SHELLS, MAX_TRIPLET_SHELLS, type ClusterKind, type ClusterOrbit, type ClusterSet } from './clusters.ts';
export { CorrelationEngine } from './correlations.ts';
export { leastSquares, quadraticForm, type LeastSquares } from './leastSquares.ts';
export { designMatrix, fitExpansion, isFitProblem, predictFromCorrelations, type ExpansionFit, type FitProblem, type TrainingStructure } from './fit.ts';
export { aboveHull, hullEnergyAt, lowerHull, HULL_TOLERANCE, type HullVertex } from './hull.ts';
export { predictStructures, type Prediction, type PredictOptions } from './predict.ts';
export { suggestNext, WINDOW_CV_SCORES, type Suggestion, type SuggestionCandidate } from './suggest.ts';
export * from './expand.ts';
