/** Child of the history bench: one whole check of the document in argv[2]; prints the peak extra resident memory over the text's bytes. */
import { readFileSync } from "node:fs";
import { checkText } from "../../src/pool/work.ts";

const hwm = () => Number(/VmHWM:\s+(\d+) kB/.exec(readFileSync("/proc/self/status", "utf8"))?.[1] ?? NaN) * 1024;
const bytes = readFileSync(process.argv[2]);
const text = bytes.toString("utf8");
checkText('{"format":"hoopwise.check/1"}'); // load and compile the modules before the baseline
const before = hwm();
const answer = checkText(text);
const peak = hwm() - before;
process.stdout.write(JSON.stringify({ status: answer.status, overInput: peak / bytes.byteLength }));
