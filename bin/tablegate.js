#!/usr/bin/env node
import { run } from "../dist/cli/run.js";

// A reader that stops early (`| head`) closes the pipe: what is left to say is dropped and the exit
// status still says the verdict. Any other failure to write is one line and exit 2, not a stack trace.
for (const stream of [process.stdout, process.stderr]) {
  stream.on("error", (e) => {
    if (e.code === "EPIPE") return;
    if (stream !== process.stderr) process.stderr.write(`tablegate: cannot write the output: ${e.code ?? e.message}\n`);
    process.exit(2);
  });
}

process.exitCode = await run(process.argv.slice(2), {
  stdout: (s) => process.stdout.write(s),
  stderr: (s) => process.stderr.write(s),
  env: process.env,
  cwd: process.cwd(),
  stderrIsTty: process.stderr.isTTY === true,
  stdoutIsTty: process.stdout.isTTY === true,
});
