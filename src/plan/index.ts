/**
 * The analysis plan file (format tandem-plan/1): build from a recommendation, write, read, check.
 *   planFromRecommendation(rec, { title?, data?, created? }) -> Plan           (pure)
 *   writePlanText(plan, planPath) -> YAML text; savePlan(plan, path, { force }) (atomic)
 *   readPlan(path) / parsePlanText(text, file) -> Plan, or InputError with positioned problems
 *   checkPlanText(text, file) -> { plan, problems }                             (for `plan check`)
 */
export { PLAN_FORMAT, type Plan, type DataMapping } from './types.js';
export { planFromRecommendation, defaultDataMapping, slugify, type PlanData, type PlanOptions } from './from-recommendation.js';
export { writePlanText, savePlan, normalizePlan, modeline, schemaReference, PLAN_SCHEMA_FILE } from './write.js';
export { readPlan, readPlanSource, parsePlanText, checkPlanText, checkPlanObject, planSchema, type PlanCheck } from './read.js';
export { semanticFindings, type PlanFinding } from './semantic.js';
export { planSummary, describePlan, describeData } from './describe.js';
export { PROCEDURES, procedureName, proceduresOf, sensitivityAllowed, isProcedureId } from './procedures.js';
