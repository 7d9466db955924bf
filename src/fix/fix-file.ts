import { stat } from "node:fs/promises";
import { checkFile } from "../check.js";
import type { Plan } from "../contract/plan.js";
import { matchHeader, positional, type HeaderMatch } from "../engine/header.js";
import { runPlan } from "../engine/run.js";
import { openDelivery, type Delivery, type InputOptions, type RawRecord } from "../input/index.js";
import { fail, ok, type Problem, type Result } from "../problem.js";
import { createAtomicFile, type AtomicFile } from "../atomic-file.js";
import { REPAIR_NAMES, type RepairName } from "./cell-repair.js";
import { changeLine, rejectLine } from "./change-log.js";
import { csvLine, type CsvDialect } from "./csv-line.js";
import { createRowRepairer, type CellChange, type RowRepairer } from "./row-repair.js";
import { createRejections } from "./row-verdicts.js";
import type { FixTargets } from "./targets.js";

/** Columns the rejects file puts before the record's own cells: its row, its line, the rules it fails. */
export const REJECT_COLUMNS = ["_row", "_line", "_rules"] as const;

/** How reports and messages name the files of one run. */
export interface FixLabels {
  readonly input: string;
  readonly contract: string;
  readonly out: string;
}

/** A count by name, in a fixed order. */
export interface Count {
  readonly name: string;
  readonly count: number;
}

/** What one `fix` run did. */
export interface FixOutcome {
  /** Data records read (as `check` counts them). */
  readonly rows: number;
  readonly cleanRows: number;
  readonly rejectedRows: number;
  /** Changed cells in the clean file. */
  readonly changedCells: number;
  /** Cells each repair touched (a cell may take two, e.g. trim and date). */
  readonly repairs: Readonly<Record<RepairName, number>>;
  /** Rejected records per rule, most first, then by rule. */
  readonly rejectedByRule: readonly Count[];
  /** Sensitive columns whose cells changed, with the number of cells; their log entries are masked. */
  readonly maskedColumns: readonly Count[];
  /** `check` over the clean file with the same plan: its verdict and the error-level checks it fails. */
  readonly cleanVerdict: "pass" | "fail";
  readonly cleanFailures: readonly Count[];
  /** The encoding the delivery was read in; outputs are always UTF-8. */
  readonly encoding: string;
}

function inputOptions(plan: Plan): InputOptions {
  return {
    format: plan.input.format === "tsv" ? "tsv" : "csv",
    delimiter: plan.input.delimiter,
    ...(plan.input.format === "tsv" ? {} : { quote: plan.input.quote }),
    encoding: plan.input.encoding,
  };
}

/** The header match of a delivery, taken from its first record unless the contract says it has none. */
interface Layout {
  header: HeaderMatch | undefined;
  repairer: RowRepairer | undefined;
}

function startLayout(plan: Plan): Layout {
  const header = plan.input.header === "none" ? positional(plan) : undefined;
  return { header, repairer: header ? createRowRepairer(plan, header) : undefined };
}

/** The delivery's records with every data record repaired, header untouched: what the engine judges. */
async function* repairedRecords(plan: Plan, delivery: Delivery): AsyncGenerator<readonly RawRecord[]> {
  const layout = startLayout(plan);
  for await (const batch of delivery.records) {
    const out: RawRecord[] = [];
    for (const rec of batch) {
      if (layout.repairer === undefined) {
        layout.header = matchHeader(plan, rec.cells, rec.line);
        layout.repairer = createRowRepairer(plan, layout.header);
        out.push(rec);
        continue;
      }
      const cells = layout.repairer.repair(rec.cells);
      out.push(cells === rec.cells ? rec : { cells, line: rec.line });
    }
    yield out;
  }
}

const counted = (m: Map<string, number>): Count[] =>
  [...m].map(([name, count]) => ({ name, count })).sort((a, b) => b.count - a.count || (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));

const bump = (m: Map<string, number>, key: string, by = 1) => m.set(key, (m.get(key) ?? 0) + by);

/**
 * Repair a delivery and split it: records that pass every error-level check of their own after repair
 * go, repaired, to `targets.out`; the others go, exactly as given, to `targets.rejects`; every changed
 * cell and every rejected record is a line of `targets.log`. The engine judges the repaired records
 * (one source of truth with `check`); a second read writes the files; `check` then judges the clean
 * file. Files replace their targets only when all of this succeeded. A delivery that cannot be read
 * to its end is a problem: splitting it would lose what follows the break.
 */
export async function fixFile(plan: Plan, input: string, targets: FixTargets, labels: FixLabels): Promise<Result<FixOutcome>> {
  if (plan.input.format !== "csv" && plan.input.format !== "tsv") {
    return fail({ file: labels.contract, message: `fix reads csv and tsv deliveries; this contract declares ${plan.input.format}` });
  }
  const options = inputOptions(plan);
  const info = await stat(input).catch(() => undefined);

  // Pass 1: the engine over the repaired records decides which records are rejected.
  const first = await openDelivery(input, options);
  if (!first.ok) return first;
  const d1 = first.value;
  const rejections = createRejections(plan);
  const judged = await runPlan(plan, repairedRecords(plan, d1), () => d1.structureBreak(), {
    maxFindings: 0,
    onRowFailure: rejections.onRowFailure,
    ...(info === undefined || input.endsWith(".gz") ? {} : { sizeHint: info.size }),
  });
  const broke = d1.structureBreak();
  if (broke) return fail({ file: labels.input, line: broke.line, message: `cannot be repaired: ${broke.message}; nothing was written` });
  const rejected = rejections.rows;
  const hash = d1.summary().sha256;

  // Pass 2: write the three files beside their targets.
  const mode = info === undefined ? 0o644 : info.mode & 0o666;
  const files: AtomicFile[] = [];
  for (const path of [targets.out, targets.rejects, targets.log]) {
    const f = await createAtomicFile(path, mode);
    if (!f.ok) {
      for (const g of files) await g.discard();
      return f;
    }
    files.push(f.value);
  }
  const [out, rej, log] = files as [AtomicFile, AtomicFile, AtomicFile];
  const discardAll = async (problems: readonly Problem[]): Promise<Result<FixOutcome>> => {
    for (const f of files) await f.discard();
    return { ok: false, problems };
  };

  const dialect: CsvDialect = { delimiter: plan.input.delimiter, quote: plan.input.format === "tsv" ? null : plan.input.quote };
  const repairs = new Map<string, number>();
  const byRule = new Map<string, number>();
  const masked = new Map<string, number>();
  let rows = 0;
  let changedCells = 0;
  let rejectedCount = 0;
  const second = await openDelivery(input, options);
  if (!second.ok) return discardAll(second.problems);
  const d2 = second.value;
  try {
    const layout = startLayout(plan);
    const changes: CellChange[] = [];
    for await (const batch of d2.records) {
      for (const rec of batch) {
        if (layout.repairer === undefined) {
          layout.header = matchHeader(plan, rec.cells, rec.line);
          layout.repairer = createRowRepairer(plan, layout.header);
          out.write(csvLine(rec.cells, dialect));
          rej.write(csvLine([...REJECT_COLUMNS, ...rec.cells], dialect));
          continue;
        }
        const row = ++rows;
        const rules = rejected.get(row);
        if (rules !== undefined) {
          rejectedCount++;
          for (const r of rules) bump(byRule, r);
          rej.write(csvLine([String(row), String(rec.line), rules.join(";"), ...rec.cells], dialect));
          log.write(rejectLine(row, rec.line, rules));
          continue;
        }
        changes.length = 0;
        out.write(csvLine(layout.repairer.repair(rec.cells, changes), dialect));
        for (const c of changes) {
          const col = plan.columns[c.column];
          if (col === undefined) continue;
          changedCells++;
          for (const r of c.repairs) bump(repairs, r);
          if (col.sensitive) bump(masked, col.name);
          log.write(changeLine(row, rec.line, col.name, c, col.sensitive));
        }
      }
      await Promise.all(files.map((f) => f.flush()));
    }
  } catch (e) {
    return discardAll([{ file: labels.out, message: `cannot be written: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}` }]);
  }
  if (d2.structureBreak() !== undefined || d2.summary().sha256 !== hash || rows !== judged.rows) {
    return discardAll([{ file: labels.input, message: "changed while it was being repaired; nothing was written" }]);
  }

  // Pass 3: the clean file as `check` sees it (UTF-8, whatever the delivery's encoding was).
  await Promise.all(files.map((f) => f.flush()));
  const verdict = await checkFile({ ...plan, input: { ...plan.input, encoding: "utf-8" } }, out.temp, {
    reportPath: labels.out,
    contractPath: labels.contract,
    maxFindings: 0,
  });
  if (!verdict.ok) return discardAll(verdict.problems);
  const cleanFailures = new Map<string, number>();
  for (const c of verdict.value.checks) if (c.level === "error" && c.failed > 0 && c.within_allowance !== true) cleanFailures.set(c.rule, c.failed);

  for (const f of files) {
    const committed = await f.commit();
    if (!committed.ok) return discardAll(committed.problems);
  }
  const repairCounts = Object.fromEntries(REPAIR_NAMES.map((r) => [r, repairs.get(r) ?? 0])) as Record<RepairName, number>;
  return ok({
    rows,
    cleanRows: rows - rejectedCount,
    rejectedRows: rejectedCount,
    changedCells,
    repairs: repairCounts,
    rejectedByRule: counted(byRule),
    maskedColumns: counted(masked),
    cleanVerdict: verdict.value.verdict,
    cleanFailures: counted(cleanFailures),
    encoding: d2.summary().encoding,
  });
}
