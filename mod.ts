/**
 * plumbline: can these measurements be treated as normally distributed, and
 * if not, which re-expression makes them so?
 *
 * Load a table, screen every numeric column, look at one variable's card
 * (the reading in words, QQ plot and histogram, every test), try
 * re-expressions, and write the result up. Every object displays itself in a
 * notebook; nothing is computed until it is shown or read.
 *
 * @example
 * ```ts
 * import { loadTable, plumb, survey } from "@plumbline/plumbline";
 *
 * // Invented data: minutes between stoppages on one filler line.
 * const table = await loadTable({
 *   minutes: [3.1, 7.4, 1.2, 15.8, 4.4, 2.9, 22.5, 6.1, 0.8, 9.7, 3.6, 12.2, 5.0, 1.9, 30.4, 8.3],
 * });
 * survey(table); // one row per numeric column, sorted by departure
 * const minutes = plumb(table, "minutes"); // its display is the card
 * const best = minutes.reexpress(); // the simplest re-expression within chance of the best
 * if (best.label !== "ln(minutes)") throw new Error(best.label);
 * if (!best.sentence().text.startsWith("ln(minutes): n = 16.")) throw new Error("write-up");
 * ```
 *
 * @module
 */

// Errors
export { PlumbError, type PlumbErrorCode } from "./lib/errors.ts";

// Reading data
export { loadTable, type LoadTableOptions, type TableSource } from "./lib/data/load_table.ts";
export type { CsvOptions } from "./lib/data/csv_text.ts";
export type { MemoryOptions } from "./lib/data/in_memory.ts";
export type { CellOptions, WordLimits } from "./lib/data/read_options.ts";
export type {
  Cells,
  CensoredCells,
  ColumnMap,
  ColumnObject,
  FrameColumnReader,
  FrameLike,
  FrameNames,
  MemorySource,
  RowObjects,
  SeriesLike,
} from "./lib/data/memory_source.ts";
export type {
  CellNote,
  CensoredLimit,
  ColumnInfo,
  ColumnKind,
  ColumnProvenance,
  HeaderRename,
  MergedLabel,
  NumericCells,
  NumericColumn,
  NumericColumnOptions,
  NumericProvenance,
  Table,
  TableSummary,
  TextColumn,
} from "./lib/data/table.ts";

// The chain
export { Plumb, plumb, type PlumbOptions, type ReexpressionChoice } from "./lib/plumb/plumb.ts";
export type { PlumbSource } from "./lib/plumb/source.ts";
export type { ReexpressRequest, Step } from "./lib/plumb/steps.ts";
export type { Sentence, SentenceOptions } from "./lib/plumb/sentence.ts";
export type { TestsTable } from "./lib/plumb/tests_view.ts";
export type { CandidatesView } from "./lib/plumb/reexpress_view.ts";
export { PlumbGroups } from "./lib/plumb/groups.ts";
export type { GroupOptions, GroupResult, GroupRow } from "./lib/plumb/group_screen.ts";
export type { ResidualRequest } from "./lib/plumb/residual_model.ts";
export { Survey, survey } from "./lib/plumb/survey.ts";
export type { GroupSentences } from "./lib/plumb/group_sentences.ts";
export { report, type ReportView } from "./lib/plumb/report_view.ts";
export type { Report, ReportOptions } from "./lib/plumb/report.ts";
export type {
  SurveyOmission,
  SurveyOptions,
  SurveyResult,
  SurveyRow,
} from "./lib/plumb/survey_screen.ts";

// Results as plain data, and how they display
export type {
  Analysis,
  SampleOrigin,
  SerialCheck,
  Subsample,
  TestOutcome,
} from "./lib/results/analysis.ts";
export {
  type Censoring,
  type CensoringLimit,
  type CensoringRos,
  censoringWords,
} from "./lib/results/censoring.ts";
export {
  type Reading,
  type ReadingCause,
  type ReadingFacts,
  type ValueAtRow,
  type Verdict,
  VERDICT_WORDS,
  type VerdictGrounds,
} from "./lib/results/reading.ts";
export {
  DISPLAY,
  type Displayable,
  type MimeBundle,
  type ReadyDisplayable,
} from "./lib/results/display.ts";
export type { Chart, ChartMeta } from "./lib/render/chart_bundle.ts";
export type { SavedFile, SaveFormat } from "./lib/render/save.ts";
export type { TopLevelSpec } from "./lib/_deps/vega_lite.ts";
export type { TableCell, TableColumn, TableModel } from "./lib/render/table.ts";

// The tests and their building blocks
export type { TestResult } from "./lib/stats/result.ts";
export { shapiroWilk } from "./lib/stats/shapiro_wilk.ts";
export { shapiroFrancia } from "./lib/stats/shapiro_francia.ts";
export { andersonDarling, type AndersonDarlingResult } from "./lib/stats/anderson_darling.ts";
export { lilliefors, type LillieforsResult } from "./lib/stats/lilliefors.ts";
export { dagostinoPearson, type DagostinoPearsonResult } from "./lib/stats/dagostino_pearson.ts";
export { jarqueBera } from "./lib/stats/jarque_bera.ts";
export { type Moments, moments } from "./lib/stats/moments.ts";
export {
  type Adjustment,
  adjustPValues,
  benjaminiHochbergAdjust,
  holmAdjust,
} from "./lib/stats/multiplicity.ts";
export { type QqData, qqData, type QqOptions } from "./lib/stats/qq_data.ts";
export {
  type BinRule,
  type HistogramData,
  histogramData,
  type HistogramOptions,
} from "./lib/stats/histogram_data.ts";
// Linear models and serial dependence
export { fitLinearModel, type LinearModelOptions } from "./lib/stats/linear_model.ts";
export type {
  AliasedColumn,
  Coefficient,
  FitTerm,
  LinearModelFit,
} from "./lib/stats/linear_model_types.ts";
export type { FactorValues, MissingCount, ModelTerms, Named } from "./lib/stats/model_design.ts";
export {
  type ResidualEnvelope,
  residualEnvelope,
  type ResidualEnvelopeOptions,
} from "./lib/stats/residual_envelope.ts";
export {
  type SerialDependence,
  serialDependence,
  type SerialOptions,
} from "./lib/stats/serial_dependence.ts";
export { type LagOneOptions, type LagOneResult, lagOneTest } from "./lib/stats/lag_one.ts";
export { type RunsResult, runsTest } from "./lib/stats/runs_test.ts";
export { normalCdf, normalPdf, normalQuantile, normalSf } from "./lib/numeric/normal.ts";
export { type RandomStream, randomSubsample, seededRandom } from "./lib/numeric/random.ts";

// Re-expressions
export {
  applyReexpression,
  invertReexpression,
  type Reexpression,
  reexpression,
  type ReexpressionKind,
} from "./lib/reexpress/reexpression.ts";
export { boxCox, boxCoxInverse } from "./lib/reexpress/box_cox.ts";
export { yeoJohnson, yeoJohnsonInverse } from "./lib/reexpress/yeo_johnson.ts";
export {
  logInverse,
  type LogOptions,
  type LogShift,
  logShift,
  logTransform,
} from "./lib/reexpress/log.ts";
export {
  squareRoot,
  squareRootInverse,
  type SquareRootOptions,
} from "./lib/reexpress/square_root.ts";
export { reciprocal, reciprocalInverse } from "./lib/reexpress/reciprocal.ts";
export { boxCoxFit } from "./lib/reexpress/box_cox_fit.ts";
export { yeoJohnsonFit } from "./lib/reexpress/yeo_johnson_fit.ts";
export type { LambdaFit, LambdaFitOptions } from "./lib/reexpress/lambda_fit.ts";
export { searchReexpressions } from "./lib/reexpress/search.ts";
export type {
  CandidateTest,
  RankedCandidate,
  ReexpressionCandidate,
  ReexpressionSearch,
  SearchOptions,
} from "./lib/reexpress/candidates.ts";
export {
  type BackTransformed,
  backTransformMean,
  type BackTransformOptions,
} from "./lib/reexpress/back_transform.ts";
export {
  type CensoredSample,
  censoredSample,
  type CensoredSampleOptions,
  type CensorSide,
} from "./lib/stats/censored_sample.ts";
export {
  type CensoredFit,
  type CensoredFitOptions,
  censoredNormalFit,
} from "./lib/stats/censored_fit.ts";
export { type CensoredRos, censoredRos } from "./lib/stats/censored_ros.ts";
export type { PlottingOptions } from "./lib/stats/plotting_positions.ts";
export {
  type CensoredPositions,
  censoredPositions,
  type LimitPosition,
} from "./lib/stats/censored_positions.ts";
export { censoredShapiroFrancia, type CensoredTestResult } from "./lib/stats/censored_normality.ts";
export { type CensoredQqData, censoredQqData } from "./lib/stats/censored_qq.ts";
export {
  censoredBoxCoxFit,
  type CensoredLambdaFit,
  censoredYeoJohnsonFit,
} from "./lib/reexpress/censored_lambda_fit.ts";
export { censoredReexpress } from "./lib/reexpress/censored_reexpress.ts";
export { censoredBackTransformMean } from "./lib/reexpress/censored_back_transform.ts";
export { normalHazard, normalLogCdf, normalLogSf } from "./lib/numeric/normal_log.ts";

// Larger than memory
export { PlumbQuery } from "./lib/plumb/query_chain.ts";
export { QueryGroups } from "./lib/plumb/query_groups.ts";
export { QuerySurvey } from "./lib/plumb/query_survey.ts";
export type {
  AggregateProfile,
  AggregateRange,
  AggregateShape,
  ColumnAggregates,
} from "./lib/results/aggregates.ts";
export { memoryAggregates } from "./lib/plumb/memory_aggregates.ts";
export {
  isQuerySource,
  QUERY_SOURCE,
  type QueryColumn,
  type QueryCounts,
  type QueryEngine,
  type QueryGroup,
  type QueryRequest,
  type QueryScreening,
  type QuerySource,
  type QueryTransform,
  type RowRun,
} from "./lib/results/query_source.ts";
export {
  scan,
  type ScanGroup,
  type ScanGroups,
  type ScanOptions,
  ScanSource,
} from "./lib/scan/scan.ts";
export type { ScanAnalysis, ScanSample } from "./lib/scan/screen.ts";
export type { ScanPrecision } from "./lib/scan/order_read.ts";
export type { EngineOptions, Pass, ScanProgress } from "./lib/scan/engine.ts";

// What the departure changes downstream
export type { StakesView } from "./lib/plumb/stakes_view.ts";
export type { GroupStakes, GroupStakesRow, GroupStakesView } from "./lib/plumb/stakes_groups.ts";
export type { RoundingJudgement } from "./lib/stats/rounding.ts";
export {
  type MeanStakes,
  type Stakes,
  stakes,
  STAKES_CAUTION,
  type StakesOptions,
} from "./lib/stakes/stakes.ts";
export {
  type CentralRange,
  type RangeFlag,
  RANK_LIMITS_MIN_N,
} from "./lib/stakes/central_range.ts";
export type { CapabilityStakes, OutsideFractions } from "./lib/stakes/specification.ts";
export type { QuantityJudgement, StakesJudgement, StakesVerdict } from "./lib/stakes/_judge.ts";
export {
  type Capability,
  capabilityIndices,
  type CapabilityOptions,
} from "./lib/stats/capability.ts";
export {
  type PercentileCapability,
  percentileCapability,
} from "./lib/stats/percentile_capability.ts";
export {
  type BcaInterval,
  bcaInterval,
  bootstrapMean,
  type BootstrapOptions,
} from "./lib/stats/bootstrap_bca.ts";
export { type MeanIntervalOptions, type TInterval, tInterval } from "./lib/stats/mean_interval.ts";
export { clopperPearson, type ProportionIntervalOptions } from "./lib/stats/proportion_interval.ts";
export {
  type QuantileInterval,
  quantileInterval,
  type QuantileIntervalOptions,
  type QuantileRanks,
} from "./lib/stats/quantile_interval.ts";
export { rankQuantile } from "./lib/stats/rank_quantile.ts";
