/**
 * plumbline: can these measurements be treated as normally distributed, and
 * if not, which re-expression makes them so?
 *
 * @example
 * ```ts
 * import { shapiroWilk } from "./mod.ts";
 * const r = shapiroWilk([148, 154, 158, 160, 161, 162, 166, 170, 182, 195, 236]);
 * if (Math.abs(r.statistic - 0.7888146948353876) > 1e-12) throw new Error("W");
 * ```
 *
 * @module
 */
export { PlumbError, type PlumbErrorCode } from "./lib/errors.ts";
export type { TestResult } from "./lib/stats/result.ts";
export { normalCdf, normalPdf, normalQuantile, normalSf } from "./lib/numeric/normal.ts";
export { type RandomStream, seededRandom } from "./lib/numeric/random.ts";
export { shapiroWilk } from "./lib/stats/shapiro_wilk.ts";
export { shapiroFrancia } from "./lib/stats/shapiro_francia.ts";
export { type Moments, moments } from "./lib/stats/moments.ts";
export { andersonDarling, type AndersonDarlingResult } from "./lib/stats/anderson_darling.ts";
export { lilliefors, type LillieforsResult } from "./lib/stats/lilliefors.ts";
export { dagostinoPearson, type DagostinoPearsonResult } from "./lib/stats/dagostino_pearson.ts";
export { jarqueBera } from "./lib/stats/jarque_bera.ts";
export {
  type Adjustment,
  adjustPValues,
  benjaminiHochbergAdjust,
  holmAdjust,
} from "./lib/stats/multiplicity.ts";
export { sortFloat64 } from "./lib/numeric/sort.ts";
export { loadTable, type LoadTableOptions, type TableSource } from "./lib/data/load_table.ts";
export type { ColumnInfo, NumericColumn, Table, TextColumn } from "./lib/data/table.ts";
export { Plumb, plumb, type PlumbOptions } from "./lib/plumb/plumb.ts";
export type { Sentence, SentenceOptions } from "./lib/plumb/sentence.ts";
export { Survey, survey } from "./lib/plumb/survey.ts";
export type { SurveyOptions, SurveyResult, SurveyRow } from "./lib/plumb/survey_screen.ts";
export { PlumbGroups } from "./lib/plumb/groups.ts";
export type { GroupOptions, GroupResult, GroupRow } from "./lib/plumb/group_screen.ts";
export type { Analysis, SampleOrigin, Subsample, TestOutcome } from "./lib/results/analysis.ts";
export {
  type Reading,
  type ReadingFacts,
  type Verdict,
  VERDICT_WORDS,
} from "./lib/results/reading.ts";
export type { ReexpressRequest } from "./lib/plumb/steps.ts";
export { boxCoxFit } from "./lib/reexpress/box_cox_fit.ts";
export { yeoJohnsonFit } from "./lib/reexpress/yeo_johnson_fit.ts";
export type { LambdaFit, LambdaFitOptions } from "./lib/reexpress/lambda_fit.ts";
export { boxCox, boxCoxInverse } from "./lib/reexpress/box_cox.ts";
export { yeoJohnson, yeoJohnsonInverse } from "./lib/reexpress/yeo_johnson.ts";
export { logInverse, logShift, logTransform } from "./lib/reexpress/log.ts";
export { squareRoot, squareRootInverse } from "./lib/reexpress/square_root.ts";
export { reciprocal, reciprocalInverse } from "./lib/reexpress/reciprocal.ts";
export { searchReexpressions } from "./lib/reexpress/search.ts";
export { backTransformMean } from "./lib/reexpress/back_transform.ts";
export { qqData } from "./lib/stats/qq_data.ts";
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
export {
  censoredBoxCoxFit,
  type CensoredLambdaFit,
  censoredYeoJohnsonFit,
} from "./lib/reexpress/censored_lambda_fit.ts";
export { censoredReexpress } from "./lib/reexpress/censored_reexpress.ts";
export { censoredBackTransformMean } from "./lib/reexpress/censored_back_transform.ts";
export { normalHazard, normalLogCdf, normalLogSf } from "./lib/numeric/normal_log.ts";
export { histogramData } from "./lib/stats/histogram_data.ts";
