import type { Command } from "commander";
import { comparePlans } from "../../analysis/comparePlans.js";
import { planProgramme } from "../../analysis/planProgramme.js";
import { preparePlan } from "../../analysis/preparePlan.js";
import { InputError } from "../../io/InputError.js";
import { loadScenario } from "../../io/loadScenario.js";
import { checkOutputTarget } from "../../io/writeOutputFile.js";
import { compareCsv } from "../../report/compareCsv.js";
import { compareJson } from "../../report/compareJson.js";
import { compareTable, type CompareLabels } from "../../report/compareTable.js";
import { formatMoney } from "../../report/formatNumber.js";
import type { CliIo } from "../CliIo.js";
import { emitOutput } from "../emitOutput.js";
import { solveExitCode, solveStatusNote, type CommandOutcome } from "../solveExitCode.js";
import { parseAmountOption, parseChoiceOption, parseIntegerOption } from "../parseOptionValues.js";
import { ENGINES } from "./planCommand.js";

interface CompareOptions {
  budget: string[];
  format: string;
  out?: string;
  force?: boolean;
  engine: string;
  timeLimit: string;
}

/**
 * `averta compare <scenario> --budget A --budget B` or `averta compare <scenarioA> <scenarioB>`:
 * what changes between two lists; exit 3 when a side has no feasible list, 4 when a side was not solved.
 */
export function registerCompareCommand(program: Command, io: CliIo, outcome: CommandOutcome): void {
  program
    .command("compare")
    .description("compare the optimal lists at two budgets, or of two scenarios: what enters, leaves or changes treatment")
    .argument("<scenario>", "scenario YAML file (A)")
    .argument("[other]", "second scenario YAML file (B); omit it and give --budget twice to compare two budgets")
    .option("-b, --budget <amount>", "a budget; give it twice (A then B) with one scenario, or once to use for both scenarios", collect, [])
    .option("-f, --format <format>", "table, json or csv", "table")
    .option("-o, --out <file>", "write to this file instead of standard output")
    .option("--force", "replace --out if it already exists")
    .option("--engine <engine>", `solver engine: ${ENGINES.join(", ")}`, "auto")
    .option("--time-limit <seconds>", "longest each solve may run before it returns its best verified list, marked time-limit with its gap (whole seconds)", "60")
    .action(async (file: string, other: string | undefined, options: CompareOptions) => {
      const format = parseChoiceOption("--format", options.format, ["table", "json", "csv"] as const);
      const engine = parseChoiceOption("--engine", options.engine, ENGINES);
      const solve = { engine, timeLimitSeconds: parseIntegerOption("--time-limit", options.timeLimit, 1, 86_400) };
      const budgets = options.budget.map((text) => parseAmountOption("--budget", text));
      if (other === undefined && budgets.length !== 2) {
        throw new InputError([{ code: "bad-option", file: "--budget", message: `compare with one scenario needs exactly two budgets, got ${budgets.length}`, hint: "write --budget 5M --budget 9.7M, or name a second scenario" }]);
      }
      if (other !== undefined && budgets.length > 1) {
        throw new InputError([{ code: "bad-option", file: "--budget", message: `compare with two scenarios takes at most one budget, got ${budgets.length}`, hint: "drop --budget to use each scenario's own budget" }]);
      }
      if (options.out !== undefined) checkOutputTarget(options.out, options.force === true);
      const scenarioA = loadScenario(file).scenario;
      const scenarioB = other === undefined ? scenarioA : loadScenario(other).scenario;
      const preparedA = preparePlan(scenarioA);
      const preparedB = other === undefined ? preparedA : preparePlan(scenarioB);
      const budgetA = budgets[0] ?? scenarioA.budget;
      const budgetB = other === undefined ? budgets[1]! : (budgets[0] ?? scenarioB.budget);
      const planA = await planProgramme(preparedA, budgetA, solve);
      const planB = await planProgramme(preparedB, budgetB, solve);
      const labels: CompareLabels =
        other === undefined
          ? { a: `budget ${formatMoney(budgetA)}`, b: `budget ${formatMoney(budgetB)}`, currency: scenarioA.currency }
          : { a: `${file} at ${formatMoney(budgetA)}`, b: `${other} at ${formatMoney(budgetB)}`, currency: scenarioA.currency };
      const comparison = comparePlans(planA, planB);
      const content =
        format === "json" ? JSON.stringify(compareJson(comparison, labels), null, 2) + "\n" : format === "csv" ? compareCsv(comparison, labels) : compareTable(comparison, labels);
      emitOutput(io, content, options.out, options.force === true);
      io.stderr(solveStatusNote(planA.solution.status, `A (${labels.a})`, planA.solution.diagnosis, planA.solution.gap));
      io.stderr(solveStatusNote(planB.solution.status, `B (${labels.b})`, planB.solution.diagnosis, planB.solution.gap));
      outcome.exitCode = solveExitCode([planA.solution.status, planB.solution.status]);
    });
}

function collect(value: string, previous: string[]): string[] {
  return [...previous, value];
}
