import { describe, expect, it } from "vitest";
import { budgetFrontier } from "../../src/analysis/budgetFrontier.js";
import type { CliIo } from "../../src/cli/CliIo.js";
import { levelProgress } from "../../src/cli/levelProgress.js";
import { randomSites, syntheticPlan } from "../analysis/syntheticPlan.js";

function capture(tty: boolean): { io: CliIo; written: string[] } {
  const written: string[] = [];
  return { io: { stdout: () => {}, stderr: (text) => written.push(text), stderrIsTty: tty }, written };
}

describe("budget-level progress (frontier and report)", () => {
  it("reports each solved level on a terminal, and nothing when standard error is not one", async () => {
    const prepared = syntheticPlan(randomSites(3, 5, 3), 0);
    const levels = [0, 1_000, 5_000, 20_000];
    const tty = capture(true);
    const frontier = await budgetFrontier(prepared, levels, {}, levelProgress(tty.io));
    expect(frontier.map((level) => level.budget)).toEqual(levels);
    expect(tty.written).toEqual(levels.map((_, i) => expect.stringContaining(`${i + 1}/${levels.length} budget levels`)));
    const piped = capture(false);
    expect(levelProgress(piped.io)).toBeUndefined();
  });
});
