/**
 * The engine's entry points (contract). Implementation: src/engine/*.ts.
 *   loadRuleBase(dir)            -> RuleBase, or InputError with every problem positioned
 *   nextQuestion(rb, answers)    -> the next Question that matters given the answers, or null
 *   classify(rb, answers)        -> Recommendation (throws InputError listing missing answers)
 */
export type { Answers, AnswerValue, Question, Recommendation, TraceStep } from './types.js';
