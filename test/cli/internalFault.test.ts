import { describe, expect, it, vi } from "vitest";
import { runCli } from "../../src/cli/runCli.js";
import { captureIo } from "./captureIo.js";

// A programmer mistake deep inside a command, simulated: it must surface as exit 1, not 2.
vi.mock("../../src/analysis/preparePlan.js", () => ({
  preparePlan: () => {
    throw new TypeError("cannot read alternatives of undefined");
  },
}));

describe("an internal fault", () => {
  it("exits 1 with one line and no stack trace, and writes nothing to stdout", async () => {
    const io = captureIo();
    const code = await runCli(["plan", "scenarios/demo.yaml"], io);
    expect(code).toBe(1);
    expect(io.out).toBe("");
    expect(io.err).toMatch(/^internal error: cannot read alternatives of undefined\n/m);
    expect(io.err).not.toMatch(/^\s+at /m);
  });
});
