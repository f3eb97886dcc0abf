import { checkSolution } from "./checkSolution.js";
import { diagnoseInfeasibility } from "./diagnoseInfeasibility.js";
import { solveWithLpSolver } from "./solveWithLpSolver.js";
import { validateProgramme } from "./validateProgramme.js";
import {
  DEFAULT_SOLVE_OPTIONS,
  type EngineName,
  type EngineResult,
  type Programme,
  type Solution,
  type SolveOptions,
} from "./types.js";

type ConcreteEngine = Exclude<EngineName, "auto">;

/**
 * Solves a programme: picks the engine (`auto` = the best one for the model's structure), runs
 * it, and verifies its answer with `checkSolution` before returning it. An answer that fails
 * verification is never reported as optimal: `auto` falls back to the next engine, and an
 * explicitly chosen engine yields status `not-solved` with the reason in `diagnosis`.
 * Outcomes (infeasible, time limit) are statuses; only malformed numbers throw (RangeError).
 */
export async function solveProgramme(programme: Programme, options: Partial<SolveOptions> = {}): Promise<Solution> {
  validateProgramme(programme);
  const settings: Required<SolveOptions> = { ...DEFAULT_SOLVE_OPTIONS, ...options };
  const engines = engineOrder(settings.engine);
  const reason = diagnoseInfeasibility(programme);
  if (reason !== undefined) {
    return emptySolution(programme, engines[0]!, "infeasible", reason);
  }
  let last: Solution | undefined;
  for (const engine of engines) {
    const raw = await runEngine(engine, programme, settings);
    last = verifyEngineResult(programme, engine, raw);
    if (last.status !== "not-solved") return last;
  }
  return last!;
}

function engineOrder(requested: EngineName): readonly ConcreteEngine[] {
  if (requested !== "auto") return [requested];
  return ["lp-solver"];
}

async function runEngine(engine: ConcreteEngine, programme: Programme, settings: Required<SolveOptions>): Promise<EngineResult> {
  switch (engine) {
    case "lp-solver":
      return solveWithLpSolver(programme, settings);
    case "exact":
    case "highs":
      return {
        status: "not-solved",
        choice: programme.groups.map(() => null),
        bound: Number.NaN,
        budgetMarginalValue: Number.NaN,
        diagnosis: `The ${engine} engine is not available in this build.`,
      };
  }
}

// Recomputes objective and cost, and refuses any answer that is not feasible.
function verifyEngineResult(programme: Programme, engine: ConcreteEngine, raw: EngineResult): Solution {
  if (raw.status === "infeasible" || raw.status === "not-solved") {
    const fallback =
      raw.status === "infeasible"
        ? "No programme meets the budget, the must-fund sites and all rules together, although each can be met on its own; relax a rule or raise the budget."
        : `The ${engine} engine gave no answer.`;
    return emptySolution(programme, engine, raw.status, raw.diagnosis ?? fallback, raw.bound);
  }
  const check = checkSolution(programme, raw.choice);
  if (!check.feasible) {
    return emptySolution(
      programme,
      engine,
      "not-solved",
      `The ${engine} engine returned a programme that failed verification (${check.problems[0]}); it was discarded.`,
    );
  }
  // An engine that proves no bound: its own claim of optimality is the only bound; none after a time-out.
  const claimed = raw.status === "optimal" ? check.objective : Number.NaN;
  const bound = Number.isNaN(raw.bound) ? claimed : Math.max(raw.bound, check.objective);
  return {
    status: raw.status,
    choice: raw.choice,
    objective: check.objective,
    cost: check.cost,
    bound,
    gap: (bound - check.objective) / Math.max(1, Math.abs(bound)),
    budgetMarginalValue: raw.budgetMarginalValue,
    engine,
    ...(raw.diagnosis === undefined ? {} : { diagnosis: raw.diagnosis }),
  };
}

function emptySolution(
  programme: Programme,
  engine: ConcreteEngine,
  status: "infeasible" | "not-solved",
  diagnosis: string,
  bound = Number.NaN,
): Solution {
  return {
    status,
    choice: programme.groups.map(() => null),
    objective: 0,
    cost: 0,
    bound,
    gap: Number.NaN,
    budgetMarginalValue: Number.NaN,
    engine,
    diagnosis,
  };
}
