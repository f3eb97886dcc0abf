import { describe, expect, it } from "vitest";
import { loadScenario } from "../../src/io/loadScenario.js";
import { cellCmfTable } from "../../src/model/cellCmfTable.js";
import { treatmentCmf } from "../../src/model/treatmentCmf.js";
import { CRASH_TYPES, SEVERITIES } from "../../src/model/types.js";

describe("cellCmfTable", () => {
  it("gives exactly treatmentCmf's value for every treatment of the demo catalogue and every crash cell", () => {
    const { treatments } = loadScenario("scenarios/demo.yaml").scenario.catalogue;
    const lookup = cellCmfTable(treatments);
    let compared = 0;
    let differing = 0;
    for (const treatment of treatments) {
      for (const type of CRASH_TYPES) {
        for (const severity of SEVERITIES) {
          if (lookup(treatment, type, severity) !== treatmentCmf(treatment, type, severity)) differing += 1;
          compared += 1;
        }
      }
    }
    expect(compared).toBe(treatments.length * 40);
    expect(differing).toBe(0);
  });
});
