import { mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, truncateSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { runCli } from "../../src/cli/runCli.js";
import { InputError } from "../../src/io/InputError.js";
import { loadScenario } from "../../src/io/loadScenario.js";
import { MAX_INPUT_BYTES } from "../../src/io/readYamlFile.js";
import { captureIo } from "../cli/captureIo.js";

const scratch = mkdtempSync(join(tmpdir(), "averta-limits-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

const DEMO_CATALOGUE = resolve("catalogs/demo-catalogue.yaml");
// A valid scenario with a placeholder for its catalogue path.
const SCENARIO = readFileSync("test/fixtures/bad/catalogue-missing.yaml", "utf8")
  .replace(/^# .*\n/, "")
  .replace("../../../catalogs/no-such-catalogue.yaml", "CATALOGUE");

function problemOf(file: string) {
  try {
    loadScenario(file);
  } catch (error) {
    if (error instanceof InputError) return error.problems[0]!;
    throw error;
  }
  return undefined;
}

function folder(name: string): string {
  const path = join(scratch, name);
  mkdirSync(path, { recursive: true });
  return path;
}

describe("size and depth limits", () => {
  it("refuses a file over the size limit before reading it (sparse file, nothing committed)", async () => {
    const file = join(scratch, "huge.yaml");
    writeFileSync(file, "name: x\n");
    truncateSync(file, MAX_INPUT_BYTES + 1);
    expect(problemOf(file)?.code).toBe("too-large");
    const io = captureIo();
    expect(await runCli(["check", file], io)).toBe(2);
    expect(io.err).toContain(`${file}: is 64.0 MiB, over the 64 MiB limit`);
  });

  it("reports nesting deeper than the parser's own stack as too-deep, not as a crash", async () => {
    const file = join(scratch, "very-deep.yaml");
    writeFileSync(file, `name: x\ndescription: ${"[".repeat(20000)}${"]".repeat(20000)}\n`);
    const problem = problemOf(file);
    expect(problem?.code).toBe("too-deep");
    expect(problem?.line).toBe(2);
    const io = captureIo();
    expect(await runCli(["check", file], io)).toBe(2);
    expect(io.err).not.toMatch(/^\s+at /m);
  });
});

// The rule (allowedInputPath.ts): a relative catalogue path must stay in the scenario's folder tree or
// in a `catalogs` folder inside the scenario's folder or any folder above it; absolute paths are
// accepted; symbolic links are followed before judging.
describe("catalogue path policy", () => {
  it("accepts a catalogue beside the scenario, in a sub-folder, and in a catalogs folder above", () => {
    const scenarios = folder("project/scenarios/2027");
    const catalogs = folder("project/catalogs");
    writeFileSync(join(scenarios, "beside.yaml"), readFileSync(DEMO_CATALOGUE));
    mkdirSync(join(scenarios, "lib"));
    writeFileSync(join(scenarios, "lib", "sub.yaml"), readFileSync(DEMO_CATALOGUE));
    writeFileSync(join(catalogs, "shared.yaml"), readFileSync(DEMO_CATALOGUE));
    for (const path of ["beside.yaml", "lib/sub.yaml", "../../catalogs/shared.yaml"]) {
      const file = join(scenarios, `uses-${path.replace(/\W/g, "_")}.yaml`);
      writeFileSync(file, SCENARIO.replace("CATALOGUE", path));
      expect(problemOf(file), path).toBeUndefined();
    }
  });

  it("accepts an absolute path anywhere", () => {
    const file = join(folder("absolute"), "scenario.yaml");
    writeFileSync(file, SCENARIO.replace("CATALOGUE", DEMO_CATALOGUE));
    expect(problemOf(file)).toBeUndefined();
  });

  it("refuses a relative path into a sibling folder that is not called catalogs", () => {
    const other = folder("siblings/other");
    writeFileSync(join(other, "cat.yaml"), readFileSync(DEMO_CATALOGUE));
    const file = join(folder("siblings/scenarios"), "scenario.yaml");
    writeFileSync(file, SCENARIO.replace("CATALOGUE", "../other/cat.yaml"));
    expect(problemOf(file)?.code).toBe("catalogue-outside");
  });

  it("refuses a symbolic link in the scenario's folder that leads outside it", () => {
    const outside = folder("links/elsewhere");
    writeFileSync(join(outside, "cat.yaml"), readFileSync(DEMO_CATALOGUE));
    const scenarios = folder("links/scenarios");
    symlinkSync(join(outside, "cat.yaml"), join(scenarios, "link.yaml"));
    const file = join(scenarios, "scenario.yaml");
    writeFileSync(file, SCENARIO.replace("CATALOGUE", "link.yaml"));
    const problem = problemOf(file);
    expect(problem?.code).toBe("catalogue-outside");
    expect(problem?.path).toBe("catalogues[0]");
  });
});
