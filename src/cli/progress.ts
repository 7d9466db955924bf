import { thousands } from "../report/thousands.js";

/** Seconds a run must last before a progress line appears. */
const QUIET_FOR_MS = 1000;
const EVERY_MS = 250;

const mb = (bytes: number) => (bytes / 1e6).toFixed(1);

function duration(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  return s < 60 ? `${s} s` : `${Math.floor(s / 60)} min ${String(s % 60).padStart(2, "0")} s`;
}

/**
 * A one-line progress display on stderr for a terminal: rows, megabytes read, rate, and time left
 * from the file's size. Silent for the first second, so quick runs and CI logs stay clean; the line
 * is rewritten in place and erased when the file is done.
 */
export function createProgress(write: (s: string) => void, label: string, totalBytes: number, bytesRead: () => number, now: () => number = Date.now) {
  const start = now();
  let last = 0;
  let shown = false;
  return {
    update(rows: number) {
      const t = now();
      if (t - start < QUIET_FOR_MS || t - last < EVERY_MS) return;
      last = t;
      const seconds = (t - start) / 1000;
      const read = bytesRead();
      const left = read > 0 && totalBytes > read ? ` · about ${duration((seconds * (totalBytes - read)) / read)} left` : "";
      write(`\r\x1b[K${label}: ${thousands(rows)} rows · ${mb(read)} of ${mb(totalBytes)} MB · ${thousands(rows / seconds)} rows/s${left}`);
      shown = true;
    },
    done() {
      if (shown) write("\r\x1b[K");
    },
  };
}
