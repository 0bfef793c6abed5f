/** The check form: field names, reading a post into a check document, and writing a document back into fields. */
export * from "../../../views/form/fields.ts";
export { readForm, blockRows, type ReadForm } from "./read.ts";
export { writeForm, convertValues, valueAt } from "./write.ts";
export { readPosted, understand, type Posted } from "./posted.ts";
export { parseNumber, parseNumberList } from "./lists.ts";
