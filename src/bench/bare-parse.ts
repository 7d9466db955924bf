import { createReadStream } from "node:fs";
import { parse } from "csv-parse";

// The baseline the bench compares tablegate with: csv-parse with its default options, counting records.
const file = process.argv[2];
if (file === undefined) {
  process.stderr.write("usage: node dist/bench/bare-parse.js <file.csv>\n");
  process.exitCode = 2;
} else {
  let records = 0;
  const parser = createReadStream(file).pipe(parse());
  try {
    for await (const _record of parser) records++;
    process.stdout.write(`${JSON.stringify({ records })}\n`);
  } catch (e) {
    process.stderr.write(`bare-parse: ${(e as Error).message}\n`);
    process.exitCode = 1;
  }
}
