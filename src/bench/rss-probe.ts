import { writeFileSync } from "node:fs";

// Preloaded into a benchmarked child with `node --import`: at exit it writes the process's peak
// resident set size (kilobytes, getrusage ru_maxrss) and its CPU time (user + system, ms) to the file
// named by TABLEGATE_BENCH_RSS_FILE, so the bench measures any child without /usr/bin/time and
// without the child's cooperation. CPU time is steadier than wall time on a shared machine.
const target = process.env["TABLEGATE_BENCH_RSS_FILE"];
if (target !== undefined && target !== "") {
  process.on("exit", () => {
    const use = process.resourceUsage();
    writeFileSync(target, `${use.maxRSS} ${(use.userCPUTime + use.systemCPUTime) / 1000}`);
  });
}
