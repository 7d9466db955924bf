import { writeFileSync } from "node:fs";
import { writeStandaloneValidators } from "./validator.js";

// Run by `npm run build` after tsc: precompiled schema validators for dist/, so that a run of the
// tool does not load ajv or compile a schema unless a user file is invalid.
writeStandaloneValidators((file, code) => writeFileSync(file, code));
