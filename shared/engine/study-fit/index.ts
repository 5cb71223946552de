export { fitStudy, type StudyFitOutcome, type StudyFitPoint, type StudyFitSettings } from './fit-study';
export { correctPoint, type CorrectedValues, type CorrectionSettings } from './corrections';
