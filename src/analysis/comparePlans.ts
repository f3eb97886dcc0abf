import type { Alternative } from "../model/types.js";
import type { FundedProject } from "./fundedProject.js";
import type { PlanResult } from "./planProgramme.js";
import type { ProgrammeTotals } from "./summariseSelection.js";
import type { SolveStatus } from "../solver/index.js";

/** A project as the comparison shows it. */
export interface ComparedProject {
  readonly site: string;
  readonly name: string;
  readonly treatments: readonly string[];
  readonly cost: number;
  readonly ksiAvoided: number;
  /** In a multi-year programme: the build year. */
  readonly buildYear?: number;
}

/** A site funded in both lists, with a different treatment set. */
export interface ChangedTreatment {
  readonly site: string;
  readonly name: string;
  readonly before: ComparedProject;
  readonly after: ComparedProject;
}

/** How one side of a comparison was solved. */
export interface ComparedSide {
  readonly status: SolveStatus;
  readonly diagnosis: string | null;
}

/** What changes from list A to list B. Deltas are B − A. */
export interface PlanComparison {
  /** Funded in B, not in A (by site id). */
  readonly entering: readonly ComparedProject[];
  /** Funded in A, not in B. */
  readonly leaving: readonly ComparedProject[];
  readonly changed: readonly ChangedTreatment[];
  /** In programmes: sites funded in both with the same treatments in a different build year. */
  readonly moved: readonly ChangedTreatment[];
  /** Each side's solver status and, when it has no list, why (e.g. must-fund sites over the budget). */
  readonly sideA: ComparedSide;
  readonly sideB: ComparedSide;
  readonly totalsA: ProgrammeTotals;
  readonly totalsB: ProgrammeTotals;
  readonly delta: { readonly spend: number; readonly projects: number; readonly ksiAvoided: number; readonly benefitPV: number; readonly bcRatio: number };
}

/**
 * Compares two funded lists site by site: which sites enter, which leave, which change treatment
 * set (order-insensitive), which (in programmes) keep it but move year, and the change in spend, KSI avoided, benefit PV and B/C (B − A).
 * Sites are matched by id, so two scenarios over the same sites compare naturally.
 */
export function comparePlans(a: PlanResult, b: PlanResult): PlanComparison {
  const inA = new Map(a.funded.map((project) => [project.entry.site.id, project]));
  const inB = new Map(b.funded.map((project) => [project.entry.site.id, project]));
  const entering = b.funded.filter((project) => !inA.has(project.entry.site.id)).map(compared);
  const leaving = a.funded.filter((project) => !inB.has(project.entry.site.id)).map(compared);
  const changed: ChangedTreatment[] = [];
  const moved: ChangedTreatment[] = [];
  for (const after of b.funded) {
    const before = inA.get(after.entry.site.id);
    if (before === undefined) continue;
    const change = { site: after.entry.site.id, name: after.entry.site.name, before: compared(before), after: compared(after) };
    if (!sameTreatments(before.alternative, after.alternative)) changed.push(change);
    else if (before.alternative.buildYear !== after.alternative.buildYear) moved.push(change);
  }
  const totalsA = a.totals;
  const totalsB = b.totals;
  return {
    entering,
    leaving,
    changed,
    moved,
    sideA: side(a),
    sideB: side(b),
    totalsA,
    totalsB,
    delta: {
      spend: totalsB.cost - totalsA.cost,
      projects: totalsB.projects - totalsA.projects,
      ksiAvoided: totalsB.ksiAvoided - totalsA.ksiAvoided,
      benefitPV: totalsB.benefitPV - totalsA.benefitPV,
      bcRatio: totalsB.bcRatio - totalsA.bcRatio,
    },
  };
}

function side(plan: PlanResult): ComparedSide {
  return { status: plan.solution.status, diagnosis: plan.solution.diagnosis ?? null };
}

function compared(project: FundedProject): ComparedProject {
  return {
    site: project.entry.site.id,
    name: project.entry.site.name,
    treatments: project.alternative.treatments,
    cost: project.alternative.cost,
    ksiAvoided: project.alternative.ksiAvoided,
    ...(project.alternative.buildYear !== undefined && { buildYear: project.alternative.buildYear }),
  };
}

function sameTreatments(x: Alternative, y: Alternative): boolean {
  const key = (alternative: Alternative) => [...alternative.treatments].sort().join("\u0000");
  return key(x) === key(y);
}
