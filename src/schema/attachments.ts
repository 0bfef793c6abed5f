/**
 * @module schema/attachments
 * The files a check sheet carries inside its PDF, by name: part of the record's contract, so a
 * reader of the sheet, the sheet builder and `verify` name them alike.
 */

/** The check document the sheet was worked from. */
export const INPUT_ATTACHMENT = "hoopwise-input.json";
/** The signed sign-offs of the revision printed. */
export const SIGNOFFS_ATTACHMENT = "hoopwise-signoffs.json";
