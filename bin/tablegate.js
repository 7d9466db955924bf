#!/usr/bin/env node
import { run } from "../dist/cli/run.js";

process.exitCode = await run(process.argv.slice(2), {
  stdout: (s) => process.stdout.write(s),
  stderr: (s) => process.stderr.write(s),
  env: process.env,
  cwd: process.cwd(),
  stderrIsTty: process.stderr.isTTY === true,
  stdoutIsTty: process.stdout.isTTY === true,
});
