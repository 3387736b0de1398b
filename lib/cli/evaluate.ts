import { readFileSync } from "node:fs";
import { caseInputSchema, evaluateParsedCase, formatIssues } from "@/lib/engine";

/**
 * `npm run evaluate -- case.json`: prints the CaseResult as JSON. An unreadable file, invalid
 * JSON or invalid input exits 2 with one line per problem on stderr, each naming its path.
 */
function fail(lines: string[]): never {
  for (const line of lines) process.stderr.write(`${line}\n`);
  process.exit(2);
}

const path = process.argv[2];
if (!path) fail(["usage: npm run evaluate -- <case.json>"]);

let text: string;
try {
  text = readFileSync(path, "utf8");
} catch (error) {
  fail([
    `${path}: cannot read the file (${(error as NodeJS.ErrnoException).code ?? String(error)})`,
  ]);
}

let json: unknown;
try {
  json = JSON.parse(text);
} catch (error) {
  fail([`${path}: not valid JSON (${(error as Error).message})`]);
}

const parsed = caseInputSchema.safeParse(json);
if (!parsed.success) fail(formatIssues(parsed.error));

process.stdout.write(`${JSON.stringify(evaluateParsedCase(parsed.data), null, 2)}\n`);
