export { fitStudy, type StudyFitOutcome, type StudyFitPoint, type StudyFitSettings } from './fit-study';
export { correctPoint, type CorrectedValues, type CorrectionSettings } from './corrections';
export {
  compareWeighting,
  poolReplicates,
  type PooledRatio,
  type PooledReplicates,
  type ReplicateReading,
  type WeightingComparison,
} from './replicates';
export { diffusionLimitFor } from './kinetics';
