import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { writeLargeScenario } from "./writeLargeScenario.js";

/** One timed command, in a fresh process: wall seconds and peak resident memory. */
export interface CommandFigure {
  readonly name: string;
  readonly seconds: number;
  readonly peakMiB: number;
  readonly exitCode: number | null;
}

/** The plan-at-scale figures and the targets they are read against. */
export interface PlanBenchResult {
  readonly sites: number;
  readonly yamlAlone: CommandFigure;
  readonly commands: readonly CommandFigure[];
  readonly summary: string;
}

// Runs `script` (ES module text) in a fresh Node process and reports its wall time and peak RSS.
function timeScript(name: string, script: string): CommandFigure {
  const started = performance.now();
  const run = spawnSync(process.execPath, ["--input-type=module", "-e", `${script}\nprocess.on("exit", () => process.stderr.write("\\nPEAK " + process.resourceUsage().maxRSS + "\\n"));`], {
    encoding: "utf8",
    maxBuffer: 1 << 30,
    stdio: ["ignore", "ignore", "pipe"],
  });
  const seconds = (performance.now() - started) / 1000;
  const peak = /PEAK (\d+)/.exec(run.stderr ?? "");
  return { name, seconds, peakMiB: peak === null ? Number.NaN : Number(peak[1]) / 1024, exitCode: run.status };
}

/**
 * `plan` on a generated 20,000-site scenario (sites file as tally writes it), from YAML in to the
 * table and to JSON out, each in a fresh process; beside it the YAML library alone parsing the
 * same files, the yardstick of the load target.
 */
export function planBench(sites = 20_000): PlanBenchResult[] {
  return (["yaml", "json"] as const).map((form) => planBenchForm(sites, form));
}

function planBenchForm(sites: number, form: "yaml" | "json"): PlanBenchResult {
  const folder = mkdtempSync(join(tmpdir(), "averta-plan-bench-"));
  try {
    const scenario = writeLargeScenario(folder, sites, form);
    const files = [scenario, join(folder, "sites.yaml")];
    const yamlModule = JSON.stringify(resolve("node_modules/yaml/dist/index.js"));
    const yamlAlone = timeScript(
      "YAML library alone (parseDocument, both files)",
      `import { readFileSync } from "node:fs"; import { parseDocument } from ${yamlModule}; for (const f of ${JSON.stringify(files)}) parseDocument(readFileSync(f, "utf8"));`,
    );
    const main = JSON.stringify(resolve("dist/src/cli/runCli.js"));
    const cli = (argv: string[]) => `import { runCli } from ${main}; const sink = { stdout: () => {}, stderr: () => {}, stderrIsTty: false }; process.exitCode = await runCli(${JSON.stringify(argv)}, sink);`;
    const commands = [
      timeScript("plan → table", cli(["plan", scenario])),
      timeScript("plan → JSON", cli(["plan", scenario, "--format", "json"])),
    ];
    const line = (figure: CommandFigure) => `  ${figure.name.padEnd(48)} ${figure.seconds.toFixed(2).padStart(7)} s  ${figure.peakMiB.toFixed(0).padStart(6)} MiB${figure.exitCode === 0 ? "" : `  exit ${figure.exitCode}`}`;
    const summary = [
      `${sites} generated sites, sites file in ${form === "json" ? "YAML's JSON form (tally --json-form)" : "block YAML"} (${(readFileSync(files[1]!).length / 1048576).toFixed(1)} MiB), each in a fresh process:`,
      line(yamlAlone),
      ...commands.map((figure) => `${line(figure)}   target ≤ 2 s, ≤ 3× YAML (${(figure.seconds / yamlAlone.seconds).toFixed(1)}×), ≤ 600 MiB`),
    ].join("\n");
    return { sites, yamlAlone, commands, summary };
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}
