import type { Command } from "commander";
import { basename } from "node:path";
import { fullFundingCost } from "../../analysis/fullFundingCost.js";
import { budgetFrontier, budgetLevels } from "../../analysis/budgetFrontier.js";
import { preparePlan } from "../../analysis/preparePlan.js";
import { formatProblem, InputError } from "../../io/InputError.js";
import { loadScenario } from "../../io/loadScenario.js";
import { checkOutputTarget, writeOutputFile } from "../../io/writeOutputFile.js";
import { reportHtml } from "../../report/html/reportHtml.js";
import { planCsv } from "../../report/planCsv.js";
import type { CliIo } from "../CliIo.js";
import { parseAmountOption, parseChoiceOption, parseIntegerOption } from "../parseOptionValues.js";
import { ENGINES } from "./planCommand.js";

interface ReportOptions {
  out: string;
  force?: boolean;
  budget?: string;
  steps: string;
  csv?: string;
  engine: string;
}

/**
 * `averta report <scenario> --out report.html`: one self-contained HTML report with the list,
 * the budget frontier and slider, a map, reasons, assumptions, warnings and cautions.
 */
export function registerReportCommand(program: Command, io: CliIo): void {
  program
    .command("report")
    .description("write a self-contained HTML report of the optimal list for finance and approval")
    .argument("<scenario>", "scenario YAML file")
    .requiredOption("-o, --out <file>", "HTML file to write")
    .option("--force", "replace --out (and --csv) if they already exist")
    .option("-b, --budget <amount>", "budget to use instead of the scenario's (4500000, 4.5M, 750k)")
    .option("--steps <n>", "budget steps on the frontier chart and slider, from 0 to the cost of every site's best option", "20")
    .option("--csv <file>", "also write the capital list as CSV")
    .option("--engine <engine>", `solver engine: ${ENGINES.join(", ")}`, "auto")
    .action(async (file: string, options: ReportOptions) => {
      const steps = parseIntegerOption("--steps", options.steps, 1, 200);
      const engine = parseChoiceOption("--engine", options.engine, ENGINES);
      const requestedBudget = options.budget === undefined ? undefined : parseAmountOption("--budget", options.budget);
      const force = options.force === true;
      if (options.csv !== undefined && options.csv === options.out) {
        throw new InputError([{ code: "bad-option", file: "--csv", message: "names the same file as --out", hint: "give the CSV its own file name" }]);
      }
      // Check every target before solving, so a refusal costs nothing and no file is half-written.
      checkOutputTarget(options.out, force);
      if (options.csv !== undefined) checkOutputTarget(options.csv, force);

      const { scenario, warnings } = loadScenario(file);
      const budget = requestedBudget ?? scenario.budget;
      const prepared = preparePlan(scenario);
      // The chosen budget joins the evenly spaced levels so the slider can return to it exactly.
      const levels = [...new Set([...budgetLevels(0, fullFundingCost(prepared), steps), budget])].sort((a, b) => a - b);
      if (io.stderrIsTty) io.stderr(`solving the optimal list at ${levels.length} budget levels...\n`);
      const frontier = await budgetFrontier(prepared, levels, { engine });
      const plan = frontier.find((level) => level.budget === budget)!.plan;
      const csvFileName = options.csv !== undefined ? basename(options.csv) : `${basename(options.out).replace(/\.html?$/i, "")}.csv`;
      const html = reportHtml({
        plan,
        frontier,
        csvFileName,
        warnings: warnings.map((warning) => ({
          where: formatProblem({ ...warning, message: "", hint: undefined }).replace(/:\s*$/, ""),
          message: warning.message,
          ...(warning.hint !== undefined && { hint: warning.hint }),
        })),
      });
      writeOutputFile(options.out, html, force);
      io.stderr(`wrote ${options.out}\n`);
      if (options.csv !== undefined) {
        writeOutputFile(options.csv, planCsv(plan), force);
        io.stderr(`wrote ${options.csv}\n`);
      }
    });
}
