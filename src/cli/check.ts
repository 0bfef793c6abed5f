import { checkDocument } from "../engine/index.ts";
import { readJsonArg, type Io } from "./io.ts";

/** `check FILE|-`: the result JSON on standard output, exit 0 whatever the verdict; exit 2 with the errors document. */
export async function checkCommand(args: string[], io: Io): Promise<number> {
  const doc = await readJsonArg(args[0], io);
  if (!doc.ok) {
    io.stdout.write(JSON.stringify({ errors: doc.errors }, null, 2) + "\n");
    return 2;
  }
  const out = checkDocument(doc.value);
  if (!out.ok) {
    io.stdout.write(JSON.stringify({ errors: out.errors }, null, 2) + "\n");
    return 2;
  }
  io.stdout.write(JSON.stringify(out.result, null, 2) + "\n");
  return 0;
}
