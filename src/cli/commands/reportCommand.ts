import type { Command } from "commander";
import { basename } from "node:path";
import { fullFundingCost } from "../../analysis/fullFundingCost.js";
import { budgetFrontier, budgetLevels } from "../../analysis/budgetFrontier.js";
import { casePlan } from "../../analysis/casePlan.js";
import type { PlanResult } from "../../analysis/planProgramme.js";
import { preparePlan, type PreparedPlan } from "../../analysis/preparePlan.js";
import { analyseUncertainty } from "../../analysis/uncertainty/analyseUncertainty.js";
import { oneAtATimeSensitivity } from "../../analysis/uncertainty/oneAtATimeSensitivity.js";
import { formatProblem } from "../../io/InputError.js";
import { loadScenario } from "../../io/loadScenario.js";
import { checkDistinctOutputs, checkOutputTarget, writeOutputFile } from "../../io/writeOutputFile.js";
import type { ReportUncertainty } from "../../report/html/ReportInput.js";
import { loadEvaluation } from "./evaluateCommand.js";
import { reportHtml } from "../../report/html/reportHtml.js";
import { planCsv } from "../../report/planCsv.js";
import { progressBar } from "../../report/progressBar.js";
import type { EngineName } from "../../solver/index.js";
import { formatMoney } from "../../report/formatNumber.js";
import type { CliIo } from "../CliIo.js";
import { levelProgress } from "../levelProgress.js";
import { solveExitCode, solveStatusNote, type CommandOutcome } from "../solveExitCode.js";
import { addDrawOptions, parseDrawOptions, type DrawOptions, type DrawOptionText } from "../drawOptions.js";
import { parseAmountOption, parseChoiceOption, parseIntegerOption } from "../parseOptionValues.js";
import { ENGINES } from "./planCommand.js";

interface ReportOptions extends DrawOptionText {
  out: string;
  force?: boolean;
  budget?: string;
  steps: string;
  csv?: string;
  evaluation?: string;
  engine: string;
  timeLimit: string;
}

/**
 * `averta report <scenario> --out report.html`: one self-contained HTML report with the list,
 * the budget frontier and slider, a map, the justification (reasons, thresholds, incremental B/C,
 * the B/C ranking comparison), robustness and sensitivity, assumptions, warnings and cautions.
 */
export function registerReportCommand(program: Command, io: CliIo, outcome: CommandOutcome): void {
  const command = program
    .command("report")
    .description("write a self-contained HTML report of the optimal list for finance and approval")
    .argument("<scenario>", "scenario YAML file");
  addDrawOptions(command, "Monte Carlo draws for the robustness and sensitivity sections (0 leaves both out)")
    .requiredOption("-o, --out <file>", "HTML file to write")
    .option("--force", "replace --out (and --csv) if they already exist")
    .option("-b, --budget <amount>", "budget to use instead of the scenario's (4500000, 4.5M, 750k)")
    .option("--steps <n>", "budget steps on the frontier chart and slider, from 0 to the cost of every site's best option", "20")
    .option("--csv <file>", "also write the capital list as CSV")
    .option("--evaluation <projects>", "add the before-after evaluation of this built-projects file (see averta evaluate)")
    .option("--engine <engine>", `solver engine: ${ENGINES.join(", ")}`, "auto")
    .option("--time-limit <seconds>", "longest each solve may run before it returns its best verified list, marked time-limit with its gap (whole seconds)", "60")
    .action(async (file: string, options: ReportOptions) => {
      const steps = parseIntegerOption("--steps", options.steps, 1, 200);
      const engine = parseChoiceOption("--engine", options.engine, ENGINES);
      const solve = { engine, timeLimitSeconds: parseIntegerOption("--time-limit", options.timeLimit, 1, 86_400) };
      const drawOptions = parseDrawOptions(options, 0);
      const requestedBudget = options.budget === undefined ? undefined : parseAmountOption("--budget", options.budget);
      const force = options.force === true;
      checkDistinctOutputs([{ option: "--out", file: options.out }, { option: "--csv", file: options.csv }]);
      // Check every target before solving, so a refusal costs nothing and no file is half-written.
      checkOutputTarget(options.out, force);
      if (options.csv !== undefined) checkOutputTarget(options.csv, force, "--csv");

      const { scenario, warnings } = loadScenario(file);
      const evaluation = options.evaluation === undefined ? undefined : loadEvaluation(options.evaluation, io).evaluation;
      const budget = requestedBudget ?? scenario.budget;
      const prepared = preparePlan(scenario);
      // The chosen budget joins the evenly spaced levels so the slider can return to it exactly.
      const levels = [...new Set([...budgetLevels(0, fullFundingCost(prepared), steps), budget])].sort((a, b) => a - b);
      const frontier = await budgetFrontier(prepared, levels, solve, levelProgress(io));
      if (io.stderrIsTty) io.stderr("\n");
      const plan = frontier.find((level) => level.budget === budget)!.plan;
      // The draws do not yet model build years; the programme section says the robustness sections are left out.
      const withDraws = drawOptions.draws > 0 && scenario.programme === undefined;
      if (drawOptions.draws > 0 && !withDraws) io.stderr("note: the robustness and sensitivity sections are left out: the draws do not yet handle a multi-year programme\n");
      const uncertainty = withDraws ? await analyseReportUncertainty(io, prepared, plan, drawOptions, engine) : undefined;
      const planCase = await casePlan(plan, solve);
      const csvFileName = options.csv !== undefined ? basename(options.csv) : `${basename(options.out).replace(/\.html?$/i, "")}.csv`;
      const html = reportHtml({
        plan,
        planCase,
        frontier,
        ...(uncertainty !== undefined && { uncertainty }),
        ...(evaluation !== undefined && { evaluation }),
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
        writeOutputFile(options.csv, planCsv(plan), force, "--csv");
        io.stderr(`wrote ${options.csv}\n`);
      }
      // The report rests on the list at its budget; a frontier level that was not solved leaves a hole in its chart.
      io.stderr(solveStatusNote(plan.solution.status, `within ${formatMoney(budget)}`, plan.solution.diagnosis, plan.solution.gap));
      const holes = frontier.filter((level) => level.plan.solution.status === "not-solved");
      for (const level of holes) io.stderr(solveStatusNote("not-solved", `at ${formatMoney(level.budget)} on the budget chart`, level.plan.solution.diagnosis, Number.NaN));
      outcome.exitCode = solveExitCode([plan.solution.status, ...holes.map((level) => level.plan.solution.status)]);
    });
}

/** The draws and one-at-a-time sensitivity about the report's list, with a progress bar on a terminal. */
async function analyseReportUncertainty(io: CliIo, prepared: PreparedPlan, plan: PlanResult, options: DrawOptions, engine: EngineName): Promise<ReportUncertainty> {
  const draws = await analyseUncertainty(prepared, {
    ...options,
    sampleBaselines: true,
    budget: plan.budget,
    solveOptions: { engine },
    ...(io.stderrIsTty && { onProgress: (done: number, total: number) => io.stderr(progressBar(done, total)) }),
  });
  if (io.stderrIsTty) io.stderr("\n");
  // The draws re-solve the list themselves; they must describe the list the report shows.
  if (draws.plan.solution.choice.some((index, group) => index !== plan.solution.choice[group])) {
    throw new Error("the uncertainty analysis solved a different list from the report's at the same budget");
  }
  return { draws, sensitivity: await oneAtATimeSensitivity(plan, { engine }) };
}
