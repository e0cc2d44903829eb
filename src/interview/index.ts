/**
 * The interview's public entry points for `tandem advise`. Importing this module does not load
 * inquirer: the prompt adapter is imported dynamically when a prompt is first needed.
 */
export { runInterview, BACK_KEYWORD, HELP_KEYWORD, type InterviewOptions } from './interview.js';
export { offerSave, type SaveChoice, type OfferSaveOptions } from './save.js';
export { missingAnswers, checkAnswers, type AnswersCheck, type NextQuestion } from './walk.js';
export {
  loadAnswersFile,
  parseAnswersText,
  answersToText,
  writeAnswersFile,
  answersSchemaRef,
  ANSWERS_FORMAT,
  type AnswersFile,
} from './answers-file.js';
export { checkValue, describeAllowed } from './check-value.js';
export { toCancelled, type PromptAdapter } from './adapter.js';
