/**
 * The worker thread's entry: piscina calls the default export with one task. Only text crosses the
 * thread boundary (the document in, the answer out), so nothing is cloned field by field.
 */
import "./yield.ts";
import type { ImportKeys } from "../store/exchange.ts";
import type { LogOptions } from "../schema/pressureLog.ts";
import { checkText, prepareImportText, previewLogText, type CheckAnswer, type ImportAnswer, type LogPreview } from "./work.ts";

export type Task =
  | { kind: "check"; text: string }
  | { kind: "check-bytes"; bytes: Uint8Array }
  /** Several small documents at once (a batch run): one hand-over to the thread for all of them. */
  | { kind: "check-many"; texts: string[] }
  /** A records import's document (UTF-8 bytes, moved) with the keys its signatures may be by. */
  | { kind: "prepare-import"; bytes: Uint8Array; keys: ImportKeys }
  /** A logger's file (UTF-8 bytes, moved) read and drawn for the page's preview. */
  | { kind: "log-preview"; bytes: Uint8Array; opts: LogOptions };

const utf8 = new TextDecoder();

export default function run(task: Task): CheckAnswer | CheckAnswer[] | ImportAnswer | LogPreview {
  switch (task.kind) {
    case "check":
      return checkText(task.text);
    case "check-bytes":
      return checkText(utf8.decode(task.bytes));
    case "check-many":
      return task.texts.map((t) => checkText(t, "the line"));
    case "prepare-import":
      return prepareImportText(utf8.decode(task.bytes), task.keys);
    case "log-preview":
      return previewLogText(utf8.decode(task.bytes), task.opts);
  }
}
