import { writeFileSync } from "node:fs";

// Preloaded into a benchmarked child with `node --import`: at exit it writes the process's peak
// resident set size (kilobytes, getrusage ru_maxrss) to the file named by TABLEGATE_BENCH_RSS_FILE,
// so the bench measures any child without /usr/bin/time and without the child's cooperation.
const target = process.env["TABLEGATE_BENCH_RSS_FILE"];
if (target !== undefined && target !== "") {
  process.on("exit", () => {
    writeFileSync(target, String(process.resourceUsage().maxRSS));
  });
}
