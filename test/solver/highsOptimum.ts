import highsModule from "highs";
import type { Programme } from "../../src/solver/types.js";

// The package is CommonJS typed as an ES default export: at run time the default import is the loader.
const highsLoader = ((highsModule as unknown as { default?: unknown }).default ?? highsModule) as unknown as typeof highsModule.default;

/**
 * The optimum of a programme by HiGHS (an independent MIP solver, used in tests only), solved
 * with mip_rel_gap 0 so its answer is proven optimal. Returns null when HiGHS finds it infeasible.
 */
export async function highsOptimum(programme: Programme): Promise<{ objective: number; choice: (number | null)[] } | null> {
  const highs = await highsLoader();
  const x = (g: number, a: number) => `x_${g}_${a}`;
  const terms = (coefficient: (g: number, a: number) => number) =>
    programme.groups.flatMap((group, g) => group.options.map((_, a) => [coefficient(g, a), x(g, a)] as const)).filter(([c]) => c !== 0).map(([c, name]) => `${c >= 0 ? "+" : "-"} ${Math.abs(c)} ${name}`).join(" ") || "0 x_0_0";
  const rows = [
    ` budget: ${terms((g, a) => programme.groups[g]!.options[a]!.cost)} <= ${programme.budget}`,
    ...programme.groups.flatMap((group, g) => (group.options.length === 0 ? [] : [` g${g}: ${group.options.map((_, a) => `+ ${x(g, a)}`).join(" ")} ${group.required ? "=" : "<="} 1`])),
    ...programme.constraints.map((c, k) => ` c${k}: ${terms((g, a) => c.coefficients[g]?.[a] ?? 0)} ${c.sense} ${c.rhs}`),
  ];
  const names = programme.groups.flatMap((group, g) => group.options.map((_, a) => x(g, a)));
  const lp = ["Maximize", ` obj: ${terms((g, a) => programme.groups[g]!.options[a]!.value)}`, "Subject To", ...rows, "Binary", ` ${names.join(" ")}`, "End"].join("\n");
  const result = highs.solve(lp, { mip_rel_gap: 0, mip_abs_gap: 0 });
  if (result.Status !== "Optimal") return null;
  const choice = programme.groups.map((group, g) => {
    const picked = group.options.findIndex((_, a) => (result.Columns[x(g, a)]?.Primal ?? 0) > 0.5);
    return picked === -1 ? null : picked;
  });
  return { objective: result.ObjectiveValue, choice };
}
