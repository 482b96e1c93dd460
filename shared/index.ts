// The public face of the calculation core: the CLI, the server and the console import from here.
export { Decimal, dec, sum, type DecimalInput } from './decimal.ts';
export * from './units/mass.ts';
export * from './units/length.ts';
export * from './units/volume.ts';
export * from './units/temperature.ts';
export * from './units/percent.ts';
export * from './units/scale-amount.ts';
export { QuantityError } from './units/quantity-error.ts';
export type * from './formula/formula-types.ts';
export type { FormulaProblem, ContentProblem, FormulaPath } from './formula/formula-problem.ts';
export {
  readFormula,
  placeProblems,
  formatProblem,
  pathText,
  type FormulaReading,
} from './formula/read-formula.ts';
export {
  MAX_ALIAS_COUNT,
  MAX_FORMULA_BYTES,
  MAX_YAML_DEPTH,
  MAX_YAML_NODES,
  TOO_LARGE_MESSAGE,
  yamlLimitProblem,
  type YamlLimit,
  type YamlLimitProblem,
} from './formula/yaml-limits.ts';
export { parseYamlWithinLimits, type GuardedYaml } from './formula/parse-yaml.ts';
export { FORMULA_ID, FORMULA_ID_PATTERN, isFormulaId } from './formula/formula-id.ts';
export { checkLibrary, formulaLibrary, type LibraryFile } from './formula/check-library.ts';
export {
  starterFormula,
  LIBRARY_SCHEMA_PATH,
  type StarterOptions,
} from './formula/starters/starter-formula.ts';
export { FORMULA_SCHEMA } from './validation/formula-validator.ts';
export type * from './calculation/calc-result.ts';
export {
  criticalFailures,
  failsCriticalLimit,
  isCriticalFailure,
} from './calculation/calc-result.ts';
export type { BatchInput } from './calculation/batch-input.ts';
export { BatchError } from './calculation/batch-error.ts';
export {
  parseBatchOptions,
  optionName,
  type RawBatchOptions,
} from './calculation/parse-batch-options.ts';
export { BATCH_OPTION_NAMES, type BatchOptionName } from './calculation/batch-option-names.ts';
export { calculate } from './calculation/calculate.ts';
export { isIsoDate, addDays } from './calculation/dates.ts';
export { planAssembly, MAX_PLAN_COUNT } from './calculation/plan/plan-assembly.ts';
export { PlanError, FORMULA_REFUSALS, type PlanRefusal } from './calculation/plan/plan-error.ts';
export {
  assemblyLibraryIssues,
  checkAssemblyLibrary,
  type FormulaLibrary,
  type LibraryIssue,
} from './calculation/plan/check-assembly-library.ts';
export { DEFAULT_LEAD_DAYS, leadDaysOf } from './calculation/plan/lead-days.ts';
export type * from './calculation/plan/plan-types.ts';
export { presentResult, roundingNote } from './presentation/present-result.ts';
export type * from './presentation/presented-result.ts';
export { presentPlan } from './presentation/present-plan.ts';
export type * from './presentation/presented-plan.ts';
export type * from './process/control-types.ts';
export { CONTROL_TEMPLATES, controlTemplate } from './process/control-templates.ts';
export { resolveControl } from './process/resolve-control.ts';
export { evaluateControl, type Clock, type EvaluateOptions } from './process/evaluate-control.ts';
export { canonicalUnit, parseReadingValue } from './process/reading-value.ts';
export { LoggerCsvError, parseLoggerCsv, type LoggedPoint } from './process/logger-csv.ts';
export { actualCureChecks, type ActualCureWeights } from './calculation/cure/actual-nitrite.ts';
export {
  ingredientStatement,
  type IngredientStatement,
  type StatementEntry,
  type StatementIngredient,
} from './labels/ingredient-statement.ts';
export { allergenStatement } from './labels/allergen-statement.ts';
export type * from './catalogue/catalogue-types.ts';
export { CATALOGUE_FILE, isCatalogueFile, isFormulaFileName } from './catalogue/catalogue-file.ts';
export {
  readCatalogue,
  STRENGTH_KEYS,
  type CatalogueReading,
  type ItemPlaces,
} from './catalogue/read-catalogue.ts';
export {
  catalogueProblems,
  linkLines,
  type LinkCatalogue,
  type LinkedLine,
} from './catalogue/link-catalogue.ts';
export { materialLines, type MaterialLine } from './catalogue/formula-lines.ts';
export { checkCatalogue } from './catalogue/check-catalogue.ts';
export { labelNames, type LabelName } from './catalogue/label-names.ts';
export { CATALOGUE_SCHEMA } from './validation/catalogue-validator.ts';
export {
  FOOD_CODE_DAYS,
  dateMark,
  type DateMark,
  type DateMarkBasis,
  type DateMarkInput,
  type ValidatedShelfLife,
} from './labels/date-mark.ts';
export { suggestLots, type FifoSuggestion, type LotTake, type StockLot } from './stock/fifo.ts';
export {
  pullAgainstStock,
  type ItemNeed,
  type ItemUse,
  type LastDelivery,
  type PullLine,
} from './stock/pull-list.ts';
export { planItemNeeds, type PlanItemNeeds } from './stock/plan-item-needs.ts';
export { PLAN_STOCK_NOTE, planStock, type StockOnHand } from './stock/plan-stock.ts';
export type * from './stock/plan-stock-types.ts';
export {
  leastCostBlend,
  type BlendRefusal,
  type BlendShare,
  type LeastCostAsk,
  type LeastCostBlend,
  type TrimOnHand,
} from './costing/least-cost-blend.ts';
export { maxGramsAtTarget } from './costing/blend-capacity.ts';
