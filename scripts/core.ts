// Command-line entry to the pure core: `npm run --silent core -- <verb> <file.json | ->`.
// Each verb lives in scripts/core-verbs/<verb>.ts and exports `run(input: unknown, context): unknown`
// (or a promise of it); context.file is the input file's path ("-" for stdin).
// Output is JSON on stdout; any input error goes to stderr with exit code 2.
import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const here = path.dirname(fileURLToPath(import.meta.url));
const verbsDir = path.join(here, "core-verbs");

function verbs(): string[] {
  return readdirSync(verbsDir)
    .filter((f) => f.endsWith(".ts"))
    .map((f) => f.slice(0, -3))
    .sort();
}

function fail(message: string): never {
  process.stderr.write(message.endsWith("\n") ? message : message + "\n");
  process.exit(2);
}

async function main() {
  const [verb, file] = process.argv.slice(2);
  const known = verbs();
  if (!verb || !known.includes(verb)) {
    fail(`usage: npm run --silent core -- <verb> <file.json | ->\nverbs: ${known.join(", ")}`);
  }
  if (!file) fail(`usage: npm run --silent core -- ${verb} <file.json | ->`);
  let text: string;
  try {
    text = file === "-" ? readFileSync(0, "utf8") : readFileSync(file, "utf8");
  } catch (e) {
    fail(`cannot read ${file}: ${(e as Error).message}`);
  }
  let input: unknown;
  try {
    input = JSON.parse(text);
  } catch (e) {
    fail(`${file}: not valid JSON (${(e as Error).message})`);
  }
  const mod = (await import(pathToFileURL(path.join(verbsDir, `${verb}.ts`)).href)) as {
    run: (input: unknown, context: { file: string }) => unknown;
  };
  let out: unknown;
  try {
    out = await mod.run(input, { file });
  } catch (e) {
    fail((e as Error).message);
  }
  process.stdout.write(typeof out === "string" ? out : JSON.stringify(out) + "\n");
}

void main();
