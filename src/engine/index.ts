/**
 * The engine's entry points (contract). Implementation: src/engine/*.ts (pure) and
 * src/rules/load.ts (reads the rule files).
 *   loadRuleBase(dir?)           -> RuleBase (default: rulesDir()), or InputError with every
 *                                   problem positioned (file, line, column)
 *   nextQuestion(rb, answers)    -> the next Question that matters given the answers, or null
 *   classify(rb, answers)        -> Recommendation (throws InputError listing missing answers,
 *                                   or answers that do not fit their question)
 *   checkRuleBase(rb)            -> CheckReport: every reachable answer path enumerated; each must
 *                                   end in exactly one outcome; unused rules, unasked questions
 *   answerProblem(q, value)      -> why a value does not fit a question, or null
 *   questionsOnPath(rb, answers) -> the questions the answers lead through, in asking order
 * Optional answers left blank are recorded as '' (read as "not given"). Answers to questions
 * that are not on the path are ignored.
 */
export type { Answers, AnswerValue, Choice, ConditionToCheck, DesignFamily, Question, Recommendation, RuleBaseView, TraceStep } from './types.js';
export type { RuleBase } from './model.js';
export { loadRuleBase, readRuleBase } from '../rules/load.js';
export { nextQuestion, answerProblem, questionsOnPath } from './ask.js';
export { classify } from './classify.js';
export { checkRuleBase, type CheckReport } from './check.js';
