/** The argument helpers live in src/arguments.ts (the service uses them too); re-exported for the commands. */
export { choiceOption, numberOption, parseCommandArgs } from '../arguments.js';
