import type { Command } from "commander";
import { preparePlan } from "../../analysis/preparePlan.js";
import { analyseUncertainty } from "../../analysis/uncertainty/analyseUncertainty.js";
import { oneAtATimeSensitivity } from "../../analysis/uncertainty/oneAtATimeSensitivity.js";
import { InputError } from "../../io/InputError.js";
import { loadScenario } from "../../io/loadScenario.js";
import { checkDistinctOutputs, checkOutputTarget, writeOutputFile } from "../../io/writeOutputFile.js";
import { formatMoney } from "../../report/formatNumber.js";
import { progressBar } from "../../report/progressBar.js";
import { tornadoSvg } from "../../report/tornadoSvg.js";
import { uncertaintyCsv } from "../../report/uncertaintyCsv.js";
import { uncertaintyJson } from "../../report/uncertaintyJson.js";
import { uncertaintyTable } from "../../report/uncertaintyTable.js";
import type { CliIo } from "../CliIo.js";
import { emitOutput } from "../emitOutput.js";
import { solveExitCode, solveStatusNote, type CommandOutcome } from "../solveExitCode.js";
import { addDrawOptions, parseDrawOptions, type DrawOptionText } from "../drawOptions.js";
import { parseAmountOption, parseChoiceOption } from "../parseOptionValues.js";
import { ENGINES } from "./planCommand.js";

const FORMATS = ["table", "json", "csv"] as const;

interface UncertaintyCommandOptions extends DrawOptionText {
  budget?: string;
  format: string;
  out?: string;
  tornado?: string;
  force?: boolean;
  fixedBaseline?: boolean;
  engine: string;
}

/** `averta uncertainty <scenario>`: how sure the chosen list is, under CMF and baseline uncertainty. */
export function registerUncertaintyCommand(program: Command, io: CliIo, outcome: CommandOutcome): void {
  const command = program
    .command("uncertainty")
    .description("draw CMFs and baselines from their uncertainty: spread of the list's results, selection probabilities, regret, one-at-a-time sensitivity")
    .argument("<scenario>", "scenario YAML file");
  addDrawOptions(command, "Monte Carlo draws")
    .option("-b, --budget <amount>", "budget to use instead of the scenario's (4500000, 4.5M, 750k)")
    .option("--fixed-baseline", "hold site baselines at their point estimates; draw CMFs only")
    .option("-f, --format <format>", "table, json or csv (the selection probabilities)", "table")
    .option("-o, --out <file>", "write to this file instead of standard output")
    .option("--tornado <file.svg>", "also write the one-at-a-time sensitivity as a tornado chart (SVG)")
    .option("--force", "replace --out and --tornado files that already exist")
    .option("--engine <engine>", `solver engine: ${ENGINES.join(", ")}`, "auto")
    .action(async (file: string, options: UncertaintyCommandOptions) => {
      const format = parseChoiceOption("--format", options.format, FORMATS);
      const engine = parseChoiceOption("--engine", options.engine, ENGINES);
      const { draws, seed, threads } = parseDrawOptions(options, 1);
      const budget = options.budget === undefined ? undefined : parseAmountOption("--budget", options.budget);
      const force = options.force === true;
      if (options.tornado !== undefined && !options.tornado.toLowerCase().endsWith(".svg")) {
        throw new InputError([{ code: "bad-option", file: "--tornado", message: `'${options.tornado}' is not an .svg file name`, hint: "give a file name ending in .svg" }]);
      }
      checkDistinctOutputs([{ option: "--out", file: options.out }, { option: "--tornado", file: options.tornado }]);
      if (options.out !== undefined) checkOutputTarget(options.out, force);
      if (options.tornado !== undefined) checkOutputTarget(options.tornado, force, "--tornado");
      const { scenario, source } = loadScenario(file);
      if (scenario.programme !== undefined) {
        // The draws recompute each alternative from its treatments over the horizon from the first year; build years would be lost.
        throw new InputError([{ code: "not-for-programme", file, ...source.positionOf(["programme"], true), path: "programme", message: "uncertainty does not yet handle a multi-year programme", hint: "run it on a one-year scenario (without programme:), e.g. the first year's budget" }]);
      }
      const prepared = preparePlan(scenario);
      const solveOptions = { engine };
      const result = await analyseUncertainty(prepared, {
        draws,
        seed,
        threads,
        sampleBaselines: options.fixedBaseline !== true,
        budget: budget ?? scenario.budget,
        solveOptions,
        ...(io.stderrIsTty && { onProgress: (done: number, total: number) => io.stderr(progressBar(done, total)) }),
      });
      if (io.stderrIsTty) io.stderr("\n");
      // The CSV holds the selection probabilities only, so it needs the sensitivity runs just for a tornado.
      const sensitivity = format === "csv" && options.tornado === undefined ? undefined : await oneAtATimeSensitivity(result.plan, solveOptions);
      const content =
        format === "csv" || sensitivity === undefined
          ? uncertaintyCsv(result)
          : format === "json"
            ? JSON.stringify(uncertaintyJson(result, sensitivity), null, 2) + "\n"
            : uncertaintyTable(result, sensitivity);
      if (options.tornado !== undefined && sensitivity !== undefined) {
        writeOutputFile(options.tornado, tornadoSvg(sensitivity, `${scenario.name}: one-at-a-time sensitivity`), force, "--tornado");
        io.stderr(`wrote ${options.tornado}\n`);
      }
      emitOutput(io, content, options.out, force);
      const { solution } = result.plan;
      io.stderr(solveStatusNote(solution.status, `within ${formatMoney(result.plan.budget)}`, solution.diagnosis, solution.gap));
      outcome.exitCode = solveExitCode([solution.status]);
    });
}
