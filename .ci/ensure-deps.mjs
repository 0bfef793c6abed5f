// Installs the locked dependencies when node_modules is missing or older than the lock file,
// so that `npm start` and `npm test` work on a fresh clone. Node built-ins only.
import { existsSync, statSync } from "node:fs";
import { execSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { dirname, join } from "node:path";

const root = join(dirname(fileURLToPath(import.meta.url)), "..");
const lock = join(root, "package-lock.json");
const marker = join(root, "node_modules", ".package-lock.json");

const stale = !existsSync(marker) || statSync(marker).mtimeMs < statSync(lock).mtimeMs;
if (stale) {
  console.error("hoopwise: installing dependencies (npm ci) ...");
  execSync("npm ci --no-audit --no-fund", { cwd: root, stdio: "inherit" });
}
