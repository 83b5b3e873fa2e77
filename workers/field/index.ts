/**
 * Spreadsight's field-data core: the only public surface of workers/field. Pure TypeScript
 * (no DOM, Node, React or comlink); runs in a browser worker and in Node.
 * Units: m, s, m/s.
 */
export { Seg2Error } from "./seg2-error";
export { readSeg2, type Seg2Record, type Seg2Trace, type Seg2Format } from "./seg2-reader";

export type { PickResult, PickTiming } from "./pick-window";
export { pickStaLta, characteristicFunction, type StaLtaOptions } from "./sta-lta-picker";
export { pickAic, type AicOptions } from "./aic-picker";
export { pickEnergyRatio, type EnergyRatioOptions } from "./energy-ratio-picker";
export { pickOnset, traceNoise, type OnsetOptions, type OnsetResult } from "./onset-picker";
export {
  neighbourPrediction,
  neighbourTolerance,
  pickQuality,
  type PickQuality,
} from "./pick-quality";
export {
  pickRecord,
  pickTrace,
  predictedWindow,
  type OnsetRecordOptions,
  type PickerChoice,
  type PickableTrace,
  type RecordPick,
} from "./pick-record";

export {
  readCsvTable,
  normalizeHeader,
  parseCsvNumber,
  type CsvIssue,
  type CsvTable,
} from "./csv-table";
export { parsePicksCsv, type PickRow, type PicksCsvResult } from "./picks-csv";
export {
  boreholeModelName,
  parseBoreholeCsv,
  type LogRow,
  type BoreholeCsvResult,
} from "./borehole-csv";
export {
  materialLookup,
  materialName,
  type MaterialEntry,
  type MaterialTable,
  type MaterialMatch,
} from "./material-lookup";
export { stationLayout, stationLayoutCsv, type StationRow } from "./station-csv";

export {
  groupByShotSide,
  shotSidePoints,
  type ObservedPick,
  type FirstArrivalFn,
  type SpreadSide,
  type ShotSide,
} from "./field-picks";
export {
  residualsFor,
  fitModel,
  compareModels,
  type PickResidual,
  type ModelFit,
} from "./residuals";
export { fitSegment, type OffsetPoint, type SegmentFit } from "./segment-fit";
export {
  interceptTimeDepths,
  type InterpretedSegment,
  type InterpretedLayer,
  type InterceptTimeResult,
} from "./intercept-time";
export {
  misfitWarnings,
  localOutliers,
  type MisfitWarning,
  type MisfitOptions,
} from "./misfit-pattern";
export { modelFirstArrival } from "./modelled-arrivals";

export { fieldApi, type FieldApi } from "./worker-api";

export {
  interpretLine,
  interpretationJson,
  LINE_METHODS,
  type LineInput,
  type LineInterpretation,
  type LineMethod,
  type RefractorSection,
  type StationDepth,
} from "./line-interpretation";
export {
  assignedLayer,
  checkAssignments,
  suggestAssignments,
  type LayerAssignment,
} from "./refractor-assignment";
export {
  elevationProfile,
  parseElevationCsv,
  surfaceFromModels,
  type ElevationPoint,
  type ElevationProfile,
  type ElevationCsvResult,
} from "./station-elevations";
export { reciprocalChecks, reciprocalTolerance, type ReciprocalCheck } from "./reciprocal-times";
export {
  interpretPlanPicks,
  layeredCandidates,
  candidateDepth,
  modelArrivalLayer,
  type PlanForInterpretation,
  type PlanInterpretation,
  type PlanInterpretationOptions,
  type CandidateMisfit,
} from "./plan-interpretation";
