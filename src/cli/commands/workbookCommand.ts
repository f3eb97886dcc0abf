import type { Command } from "commander";
import { budgetFrontier, budgetLevels } from "../../analysis/budgetFrontier.js";
import { casePlan } from "../../analysis/casePlan.js";
import { fullFundingCost } from "../../analysis/fullFundingCost.js";
import { planProgramme } from "../../analysis/planProgramme.js";
import { preparePlan } from "../../analysis/preparePlan.js";
import { formatProblem } from "../../io/InputError.js";
import { loadScenario } from "../../io/loadScenario.js";
import { checkOutputTarget, writeOutputFile } from "../../io/writeOutputFile.js";
import type { Objective } from "../../model/types.js";
import { formatMoney } from "../../report/formatNumber.js";
import { hasList } from "../../report/hasList.js";
import { buildWorkbook } from "../../report/workbook/buildWorkbook.js";
import { workbookXlsx } from "../../report/workbook/workbookXlsx.js";
import type { CliIo } from "../CliIo.js";
import { levelProgress } from "../levelProgress.js";
import { parseAmountOption, parseChoiceOption, parseIntegerOption } from "../parseOptionValues.js";
import { solveExitCode, solveStatusNote, type CommandOutcome } from "../solveExitCode.js";
import { ENGINES } from "./planCommand.js";

interface WorkbookOptions {
  out: string;
  force?: boolean;
  budget?: string;
  objective?: string;
  engine: string;
  timeLimit: string;
  steps: string;
}

/** `averta workbook <scenario> --out FILE.xlsx`: the plan as a workbook whose money figures are live formulas. */
export function registerWorkbookCommand(program: Command, io: CliIo, outcome: CommandOutcome): void {
  program
    .command("workbook")
    .description("write the optimal list as an .xlsx workbook for finance review: every money figure a formula over the stated assumptions")
    .argument("<scenario>", "scenario YAML file")
    .requiredOption("-o, --out <file>", "the .xlsx file to write")
    .option("--force", "replace --out if it already exists")
    .option("-b, --budget <amount>", "budget to use instead of the scenario's (4500000, 4.5M, 750k)")
    .option("--objective <what>", "ksi (K+A crashes avoided) or benefit (monetised benefit PV)")
    .option("--engine <engine>", `solver engine: ${ENGINES.join(", ")}`, "auto")
    .option("--time-limit <seconds>", "longest each solve may run before it returns its best verified list, marked time-limit with its gap (whole seconds)", "60")
    .option("--steps <n>", "budget steps on the Budget levels sheet, from 0 to the cost of every site's best option; 0 leaves the sheet out", "20")
    .action(async (file: string, options: WorkbookOptions) => {
      const engine = parseChoiceOption("--engine", options.engine, ENGINES);
      const solve = { engine, timeLimitSeconds: parseIntegerOption("--time-limit", options.timeLimit, 1, 86_400) };
      const steps = parseIntegerOption("--steps", options.steps, 0, 200);
      const objective = options.objective === undefined ? undefined : parseChoiceOption<Objective>("--objective", options.objective, ["ksi", "benefit"]);
      const requestedBudget = options.budget === undefined ? undefined : parseAmountOption("--budget", options.budget);
      const force = options.force === true;
      checkOutputTarget(options.out, force);
      const { scenario, warnings } = loadScenario(file);
      if (warnings.length > 0) io.stderr(`note: ${warnings.length} warning(s) about the input; 'averta check ${file}' lists them\n`);
      for (const warning of warnings) if (warning.code === "eb-fallback") io.stderr(`warning: ${formatProblem(warning)}\n`);
      const budget = requestedBudget ?? scenario.budget;
      const prepared = preparePlan(scenario, objective);
      const plan = await planProgramme(prepared, budget, solve);
      const planCase = hasList(plan) ? await casePlan(plan, solve) : undefined;
      const levels = steps === 0 ? [] : [...new Set([...budgetLevels(0, fullFundingCost(prepared), steps), budget])].sort((a, b) => a - b);
      const frontier = await budgetFrontier(prepared, levels, solve, levelProgress(io));
      if (io.stderrIsTty && levels.length > 0) io.stderr("\n");
      const bytes = await workbookXlsx(buildWorkbook({ plan, ...(planCase !== undefined && { planCase }), frontier }));
      writeOutputFile(options.out, bytes, force);
      io.stderr(`wrote ${options.out}\n`);
      io.stderr(solveStatusNote(plan.solution.status, `within ${formatMoney(budget)}`, plan.solution.diagnosis, plan.solution.gap));
      const holes = frontier.filter((level) => level.plan.solution.status === "not-solved");
      outcome.exitCode = solveExitCode([plan.solution.status, ...holes.map((level) => level.plan.solution.status)]);
    });
}
