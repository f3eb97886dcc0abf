import type { Command } from "commander";
import { casePlan } from "../../analysis/casePlan.js";
import { planProgramme } from "../../analysis/planProgramme.js";
import { preparePlan } from "../../analysis/preparePlan.js";
import { formatProblem } from "../../io/InputError.js";
import { loadScenario } from "../../io/loadScenario.js";
import { checkOutputTarget } from "../../io/writeOutputFile.js";
import type { Objective } from "../../model/types.js";
import { planCsv } from "../../report/planCsv.js";
import { planJson } from "../../report/planJson.js";
import { PLAN_TABLE_ROWS, planTable } from "../../report/planTable.js";
import { justificationJson } from "../../report/justificationJson.js";
import { hasList } from "../../report/hasList.js";
import { formatMoney } from "../../report/formatNumber.js";
import { justificationTable } from "../../report/justificationTable.js";
import type { EngineName } from "../../solver/index.js";
import type { CliIo } from "../CliIo.js";
import { emitOutput } from "../emitOutput.js";
import { jsonChunks } from "../../report/jsonChunks.js";
import { solveExitCode, solveStatusNote, type CommandOutcome } from "../solveExitCode.js";
import { parseAmountOption, parseChoiceOption, parseIntegerOption } from "../parseOptionValues.js";

export const ENGINES: readonly EngineName[] = ["auto", "exact", "lp-solver", "highs"];
export const FORMATS = ["table", "json", "csv"] as const;

interface PlanOptions {
  budget?: string;
  objective?: string;
  format: string;
  out?: string;
  force?: boolean;
  engine: string;
  timeLimit: string;
  all?: boolean;
}

/** `averta plan <scenario>`: the optimal capital list within the budget; exit 3 when infeasible, 4 when not solved. */
export function registerPlanCommand(program: Command, io: CliIo, outcome: CommandOutcome): void {
  program
    .command("plan")
    .description("choose the treatments to fund that avoid the most K+A (fatal and serious-injury) crashes within the budget")
    .argument("<scenario>", "scenario YAML file")
    .option("-b, --budget <amount>", "budget to use instead of the scenario's (4500000, 4.5M, 750k)")
    .option("--objective <what>", "ksi (K+A crashes avoided) or benefit (monetised benefit PV)")
    .option("-f, --format <format>", "table, json or csv", "table")
    .option("-o, --out <file>", "write to this file instead of standard output")
    .option("--force", "replace --out if it already exists")
    .option("--all", `list every project in the table, not only the ${PLAN_TABLE_ROWS} with the most value`)
    .option("--engine <engine>", `solver engine: ${ENGINES.join(", ")}`, "auto")
    .option("--time-limit <seconds>", "longest each solve may run before it returns its best verified list, marked time-limit with its gap (whole seconds)", "60")
    .action(async (file: string, options: PlanOptions) => {
      const format = parseChoiceOption("--format", options.format, FORMATS);
      const engine = parseChoiceOption("--engine", options.engine, ENGINES);
      const solve = { engine, timeLimitSeconds: parseIntegerOption("--time-limit", options.timeLimit, 1, 86_400) };
      const objective = options.objective === undefined ? undefined : parseChoiceOption<Objective>("--objective", options.objective, ["ksi", "benefit"]);
      const budget = options.budget === undefined ? undefined : parseAmountOption("--budget", options.budget);
      if (options.out !== undefined) checkOutputTarget(options.out, options.force === true);
      const { scenario, warnings } = loadScenario(file);
      if (warnings.length > 0) io.stderr(`note: ${warnings.length} warning(s) about the input; 'averta check ${file}' lists them\n`);
      for (const warning of warnings) if (warning.code === "eb-fallback") io.stderr(`warning: ${formatProblem(warning)}\n`);
      const result = await planProgramme(preparePlan(scenario, objective), budget ?? scenario.budget, solve);
      // Without a list there is nothing to justify: the diagnosis says why.
      const planCase = format === "csv" || !hasList(result) ? undefined : await casePlan(result, solve);
      const content =
        format === "json"
          ? withNewline(jsonChunks({ ...planJson(result), justification: planCase ? justificationJson(planCase) : null }))
          : format === "csv"
            ? planCsv(result)
            : planTable(result, planCase ? [justificationTable(planCase, { all: options.all })] : [], { all: options.all });
      emitOutput(io, content, options.out, options.force === true);
      const { solution } = result;
      io.stderr(solveStatusNote(solution.status, `within ${formatMoney(result.budget)}`, solution.diagnosis, solution.gap));
      outcome.exitCode = solveExitCode([solution.status]);
    });
}

// The JSON text in pieces, ended by a line break as every output is.
function* withNewline(chunks: Iterable<string>): Generator<string> {
  yield* chunks;
  yield "\n";
}
