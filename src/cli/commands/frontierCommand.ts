import type { Command } from "commander";
import { budgetFrontier, budgetLevels } from "../../analysis/budgetFrontier.js";
import { fullFundingCost } from "../../analysis/fullFundingCost.js";
import { preparePlan } from "../../analysis/preparePlan.js";
import { summariseFrontier } from "../../analysis/summariseFrontier.js";
import { InputError } from "../../io/InputError.js";
import { loadScenario } from "../../io/loadScenario.js";
import { checkDistinctOutputs, checkOutputTarget, writeOutputFile } from "../../io/writeOutputFile.js";
import { frontierCsv } from "../../report/frontierCsv.js";
import { frontierJson } from "../../report/frontierJson.js";
import { frontierSvg } from "../../report/frontierSvg.js";
import { formatMoney } from "../../report/formatNumber.js";
import { frontierTable, type FrontierContext } from "../../report/frontierTable.js";
import type { CliIo } from "../CliIo.js";
import { levelProgress } from "../levelProgress.js";
import { emitOutput } from "../emitOutput.js";
import { frontierExitCode, solveStatusNote, type CommandOutcome } from "../solveExitCode.js";
import { parseAmountOption, parseChoiceOption, parseIntegerOption } from "../parseOptionValues.js";
import { ENGINES, FORMATS } from "./planCommand.js";

interface FrontierOptions {
  from?: string;
  to?: string;
  steps: string;
  format: string;
  out?: string;
  chart?: string;
  force?: boolean;
  engine: string;
  timeLimit: string;
}

/**
 * `averta frontier <scenario>`: the optimal list's K+A crashes avoided, spend and B/C at a range of
 * budgets. Infeasible levels are part of the result; exit 3 only when no level has a list, 4 when
 * a level was not solved.
 */
export function registerFrontierCommand(program: Command, io: CliIo, outcome: CommandOutcome): void {
  program
    .command("frontier")
    .description("solve the programme at a range of budgets and show what each extra million buys")
    .argument("<scenario>", "scenario YAML file")
    .option("--from <amount>", "lowest budget (default 0)")
    .option("--to <amount>", "highest budget (default: the cost of funding every site's best alternative)")
    .option("--steps <n>", "number of equal budget steps (levels = steps + 1)", "20")
    .option("-f, --format <format>", "table, json or csv", "table")
    .option("-o, --out <file>", "write to this file instead of standard output")
    .option("--chart <file.svg>", "also write an SVG chart of K+A crashes avoided against budget")
    .option("--force", "replace --out or --chart if it already exists")
    .option("--engine <engine>", `solver engine: ${ENGINES.join(", ")}`, "auto")
    .option("--time-limit <seconds>", "longest each solve may run before it returns its best verified list, marked time-limit with its gap (whole seconds)", "60")
    .action(async (file: string, options: FrontierOptions) => {
      const format = parseChoiceOption("--format", options.format, FORMATS);
      const engine = parseChoiceOption("--engine", options.engine, ENGINES);
      const solve = { engine, timeLimitSeconds: parseIntegerOption("--time-limit", options.timeLimit, 1, 86_400) };
      const steps = parseIntegerOption("--steps", options.steps, 1, 500);
      const from = options.from === undefined ? 0 : parseAmountOption("--from", options.from);
      const force = options.force === true;
      if (options.chart !== undefined && !options.chart.toLowerCase().endsWith(".svg")) {
        throw new InputError([{ code: "bad-option", file: "--chart", message: `'${options.chart}' is not an .svg file name`, hint: "the chart is SVG; give a file name ending in .svg" }]);
      }
      checkDistinctOutputs([{ option: "--out", file: options.out }, { option: "--chart", file: options.chart }]);
      if (options.out !== undefined) checkOutputTarget(options.out, force);
      if (options.chart !== undefined) checkOutputTarget(options.chart, force, "--chart");
      const { scenario } = loadScenario(file);
      const prepared = preparePlan(scenario);
      const fullCost = fullFundingCost(prepared);
      if (options.to === undefined && from >= fullCost) {
        throw new InputError([{ code: "bad-option", file: "--from", message: `${formatMoney(from)} is at or above ${formatMoney(fullCost)}, the cost of funding every site's best alternative, so every level would be the same`, hint: "give a lower --from, or --to as well" }]);
      }
      const to = options.to === undefined ? fullCost : parseAmountOption("--to", options.to);
      if (to <= from) {
        throw new InputError([{ code: "bad-option", file: "--to", message: `${formatMoney(to)} is not above --from ${formatMoney(from)}`, hint: "give --to a larger amount than --from, e.g. --from 1M --to 5M" }]);
      }
      const frontier = await budgetFrontier(prepared, budgetLevels(from, to, steps), solve, levelProgress(io));
      if (io.stderrIsTty) io.stderr("\n");
      const summary = summariseFrontier(frontier);
      const context: FrontierContext = { scenarioName: scenario.name, currency: scenario.currency, scenarioBudget: scenario.budget, objective: prepared.objective };
      const content =
        format === "json"
          ? JSON.stringify(frontierJson(summary, context), null, 2) + "\n"
          : format === "csv"
            ? frontierCsv(summary, context)
            : frontierTable(summary, context);
      if (options.chart !== undefined) {
        writeOutputFile(options.chart, frontierSvg(summary, context), force, "--chart");
        io.stderr(`wrote ${options.chart}\n`);
      }
      emitOutput(io, content, options.out, force);
      const statuses = frontier.map((level) => level.plan.solution.status);
      outcome.exitCode = frontierExitCode(statuses);
      for (const level of frontier) {
        // Levels below the must-fund cost are expected to be infeasible; say so only when none has a list.
        if (level.plan.solution.status === "infeasible" && outcome.exitCode === 0) continue;
        io.stderr(solveStatusNote(level.plan.solution.status, `at ${formatMoney(level.budget)}`, level.plan.solution.diagnosis, level.plan.solution.gap));
      }
    });
}
