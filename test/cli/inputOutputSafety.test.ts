import { spawn, spawnSync } from "node:child_process";
import { copyFileSync, existsSync, linkSync, mkdirSync, openSync, mkdtempSync, readdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from "node:fs";
import { createHash } from "node:crypto";
import { hostname, tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { terminalSafeText } from "../../src/cli/terminalSafeText.js";
import { writeOutputFile } from "../../src/io/writeOutputFile.js";
import { runCaptured } from "./captureIo.js";

// Fault classes from an outside review of hostile input and output (common practice for a CLI
// that writes users' files: never lose data, never hang, never print a stack trace).
const MAIN = resolve("dist/src/cli/main.js");
const DEMO = resolve("scenarios/demo.yaml");
const CATALOGUE = resolve("catalogs/demo-catalogue.yaml");
const scratch = mkdtempSync(join(tmpdir(), "averta-safety-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

let counter = 0;
function folder(): string {
  const path = join(scratch, `case-${++counter}`);
  mkdirSync(path);
  return path;
}

/** The demo scenario copied into `into`, naming the demo catalogue by its absolute path. */
function demoCopy(into: string, edit: (text: string) => string = (text) => text): string {
  const file = join(into, "scenario.yaml");
  writeFileSync(file, edit(readFileSync(DEMO, "utf8").replace("catalogues: [../catalogs/demo-catalogue.yaml]", `catalogues: [${JSON.stringify(CATALOGUE)}]`)));
  return file;
}

function run(argv: readonly string[]): { code: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, [MAIN, ...argv], { encoding: "utf8", timeout: 60_000 });
  return { code: result.status, stdout: result.stdout ?? "", stderr: result.stderr ?? "" };
}

function expectCleanRefusal(result: { code: number | null; stderr: string }, message: RegExp): void {
  expect(result.code).toBe(2);
  expect(result.stderr).toMatch(message);
  expect(result.stderr).not.toMatch(/\n\s+at |internal error/);
}

describe("output safety", () => {
  it("standard output on a full disk is one clear error and exit 2", () => {
    if (!existsSync("/dev/full")) return;
    const result = spawnSync(process.execPath, [MAIN, "plan", DEMO, "--format", "json"], { stdio: ["ignore", openSync("/dev/full", "w"), "pipe"], encoding: "utf8" });
    expectCleanRefusal({ code: result.status, stderr: result.stderr }, /error: standard output: cannot be written: no space left on device/);
  });

  it("standard output closed by its reader is one clear error and exit 2", async () => {
    const child = spawn(process.execPath, [MAIN, "plan", DEMO, "--format", "json"], { stdio: ["ignore", "pipe", "pipe"] });
    child.stdout.destroy();
    let stderr = "";
    child.stderr.on("data", (chunk: Buffer) => (stderr += chunk.toString()));
    const code = await new Promise<number | null>((done) => child.on("close", done));
    expectCleanRefusal({ code, stderr }, /error: standard output: cannot be written: the reader closed the pipe/);
  });

  it("a trailing slash or an over-long name exits 2 with a message", () => {
    const here = folder();
    expectCleanRefusal(run(["plan", DEMO, "--out", `${here}/plan.json/`]), /ends with a slash/);
    expectCleanRefusal(run(["plan", DEMO, "--out", join(here, `${"x".repeat(300)}.json`)]), /file name is 305 bytes long/);
    expect(readdirSync(here)).toEqual([]);
  });

  it("--force never replaces an input of the run, by name, hard link or symbolic link", () => {
    const here = folder();
    const scenario = demoCopy(here);
    const before = readFileSync(scenario, "utf8");
    linkSync(scenario, join(here, "hard-link.yaml"));
    symlinkSync(scenario, join(here, "soft-link.yaml"));
    const catalogueCopy = join(here, "catalogue.yaml");
    copyFileSync(CATALOGUE, catalogueCopy);
    const withCopy = demoCopy(folder(), (text) => text.replace(JSON.stringify(CATALOGUE), JSON.stringify(catalogueCopy)));
    for (const out of [scenario, join(here, "hard-link.yaml"), join(here, "soft-link.yaml")]) {
      expectCleanRefusal(run(["plan", scenario, "--out", out, "--force"]), /an input of this run, and is never overwritten/);
    }
    expectCleanRefusal(run(["plan", withCopy, "--out", catalogueCopy, "--force"]), /an input of this run/);
    expect(readFileSync(scenario, "utf8")).toBe(before);
    expect(readFileSync(catalogueCopy, "utf8")).toBe(readFileSync(CATALOGUE, "utf8"));
  });

  it("--force never replaces a folder, a device or a FIFO", () => {
    const here = folder();
    mkdirSync(join(here, "a-folder"));
    expectCleanRefusal(run(["plan", DEMO, "--out", join(here, "a-folder"), "--force"]), /is a folder/);
    expectCleanRefusal(run(["plan", DEMO, "--out", "/dev/null", "--force"]), /is a device, not a regular file/);
    const fifo = join(here, "pipe");
    if (spawnSync("mkfifo", [fifo]).status === 0) expectCleanRefusal(run(["plan", DEMO, "--out", fifo, "--force"]), /named pipe \(FIFO\)/);
  });

  it("of two runs writing one new file without --force, exactly one wins and the other exits 2", async () => {
    const here = folder();
    const target = join(here, "plan.json");
    const start = () =>
      new Promise<number | null>((done) => {
        const child = spawn(process.execPath, [MAIN, "plan", DEMO, "--format", "json", "--out", target], { stdio: "ignore" });
        child.on("close", done);
      });
    for (let round = 0; round < 3; round += 1) {
      rmSync(target, { force: true });
      const codes = await Promise.all([start(), start()]);
      expect(codes.sort()).toEqual([0, 2]);
      expect(JSON.parse(readFileSync(target, "utf8")).status).toBe("optimal");
      expect(readdirSync(here)).toEqual(["plan.json"]);
    }
  });

  it("a run killed mid-write leaves a temporary the next write removes; a live run's and another machine's are kept", () => {
    const here = folder();
    // The host tag as writeOutputFile makes it: the first 6 hex digits of the SHA-256 of the host name.
    const host = createHash("sha256").update(hostname()).digest("hex").slice(0, 6);
    // A process that has ended: its pid is free, as a killed writer's would be.
    const dead = spawnSync(process.execPath, ["-e", "process.stdout.write(String(process.pid))"], { encoding: "utf8" });
    const stale = `.plan.json.averta-${host}-${dead.stdout}-0123abcd.tmp`;
    const live = `.plan.json.averta-${host}-${process.pid}-4567cdef.tmp`;
    const elsewhere = `.plan.json.averta-${host === "abcdef" ? "fedcba" : "abcdef"}-${dead.stdout}-89abcdef.tmp`;
    for (const name of [stale, live, elsewhere]) writeFileSync(join(here, name), "part of a file");
    writeOutputFile(join(here, "other.json"), "{}", false);
    expect(readdirSync(here).sort()).toEqual([live, elsewhere, "other.json"].sort());
  });

  it("a real kill -9 during a large write is cleaned by the next write", async () => {
    const here = folder();
    const target = join(here, "big.txt");
    const script = `import { writeOutputFile } from ${JSON.stringify(resolve("dist/src/io/writeOutputFile.js"))}; process.stdout.write("go\\n"); writeOutputFile(${JSON.stringify(target)}, "x".repeat(400 * 1024 * 1024), false);`;
    const child = spawn(process.execPath, ["--input-type=module", "-e", script], { stdio: ["ignore", "pipe", "ignore"] });
    await new Promise<void>((done) => child.stdout.once("data", () => done()));
    // Wait until its temporary exists, then kill it without a chance to clean up.
    for (let tries = 0; tries < 200 && !readdirSync(here).some((name) => name.endsWith(".tmp")); tries += 1) await new Promise((done) => setTimeout(done, 10));
    child.kill("SIGKILL");
    await new Promise((done) => child.on("close", done));
    writeOutputFile(join(here, "next.txt"), "ok", false);
    expect(readdirSync(here).filter((name) => name !== "big.txt")).toEqual(["next.txt"]);
  });
});

describe("reading input", () => {
  it("a device or FIFO as scenario, catalogue or crash file is refused at once", () => {
    const here = folder();
    expectCleanRefusal(run(["check", "/dev/zero"]), /\/dev\/zero: is a device, not a regular file/);
    const fifo = join(here, "pipe.yaml");
    if (spawnSync("mkfifo", [fifo]).status !== 0) return;
    expectCleanRefusal(run(["check", fifo]), /named pipe \(FIFO\), not a regular file/);
    const scenario = demoCopy(here, (text) => text.replace(JSON.stringify(CATALOGUE), JSON.stringify(fifo)));
    expectCleanRefusal(run(["plan", scenario]), /pipe.yaml. is a named pipe \(FIFO\), not a regular file/);
    expectCleanRefusal(run(["tally", "--crashes", "/dev/zero", "--sites", resolve("scenarios/vellmar-sites.geojson"), "--out", join(here, "s.yaml")]), /\/dev\/zero: is a device/);
  });

  it("names of built-in object properties are ordinary ids in every command", async () => {
    const file = "test/fixtures/good/prototype-names.yaml";
    for (const argv of [["check", file], ["plan", file], ["plan", file, "--format", "csv"], ["screen", file], ["frontier", file, "--steps", "3"], ["compare", file, "--budget", "20k", "--budget", "25k"], ["uncertainty", file, "--draws", "10", "--threads", "1"]]) {
      const result = await runCaptured(argv);
      expect(result.code, `${argv.join(" ")}: ${result.stderr}`).toBe(0);
    }
    const json = JSON.parse((await runCaptured(["plan", file, "--format", "json"])).stdout) as { selected: { site: string; treatments: string[]; cost: number }[] };
    // The must-fund rule holds, and the site's own cost override for "toString" is used where chosen.
    expect(json.selected.find((project) => project.site === "constructor")?.treatments).toEqual(["isPrototypeOf"]);
    expect(json.selected.every((project) => Number.isFinite(project.cost))).toBe(true);
  });
});

describe("confinement", () => {
  it("a catalogue reached through a symbolic link out of the scenario's folder is refused, and allowed only with --allow-outside-files", async () => {
    const outside = folder();
    writeFileSync(join(outside, "secret.yaml"), "root:x:0:0:the secret line\n");
    copyFileSync(CATALOGUE, join(outside, "city.yaml"));
    const here = folder();
    symlinkSync(outside, join(here, "catalogs"));
    for (const name of ["secret.yaml", "city.yaml"]) {
      const scenario = join(here, `with-${name}`);
      writeFileSync(scenario, readFileSync(DEMO, "utf8").replace("catalogues: [../catalogs/demo-catalogue.yaml]", `catalogues: [catalogs/${name}]`));
      const refused = await runCaptured(["check", scenario]);
      expect(refused.code).toBe(2);
      expect(refused.stderr).toMatch(/lies outside the scenario's folder/);
      expect(refused.stderr).not.toContain("the secret line");
    }
    const allowed = await runCaptured(["check", join(here, "with-city.yaml"), "--allow-outside-files"]);
    expect(allowed.code, allowed.stderr).toBe(0);
    // The option is for one run only.
    expect((await runCaptured(["check", join(here, "with-city.yaml")])).code).toBe(2);
  });
});

describe("terminal safety", () => {
  it("escapes ANSI and OSC escapes, BEL, backspace and bidi overrides, keeping line ends", () => {
    expect(terminalSafeText("a\u001b[31mred\u0007\b\u202e\r\nz\n\tq\rw")).toBe("a\\u001b[31mred\\u0007\\u0008\\u202e\r\nz\n\tq\\u000dw");
    // The same form is a JSON escape: JSON output keeps its meaning.
    expect(JSON.parse(terminalSafeText(JSON.stringify({ name: "x\u202ey\u009b" })))).toEqual({ name: "x\u202ey\u009b" });
  });

  it("prints hostile names escaped in tables and errors alike", async () => {
    const here = folder();
    const scenario = demoCopy(here, (text) => text.replace("name: Market Street / Bridge Street", 'name: "Market\\e]0;pwned\\u0007 Street\\e[2J\\u202e"'));
    const table = await runCaptured(["plan", scenario]);
    expect(table.code).toBe(0);
    // The table may wrap the long name; every escape is still written out, none left raw.
    expect(table.stdout.match(/\\u001b/g)?.length).toBeGreaterThanOrEqual(2);
    expect(table.stdout).toContain("\\u0007");
    const json = await runCaptured(["plan", scenario, "--format", "json"]);
    expect(json.stdout).toContain("Market\\u001b]0;pwned\\u0007 Street\\u001b[2J\\u202e");
    expect(table.stdout).not.toMatch(/[\u001b\u0007\u202e]/);
    const bad = demoCopy(folder(), (text) => text.replace("candidates: [leading-pedestrian-interval", 'candidates: ["bad\\e[31mid"'));
    const error = await runCaptured(["check", bad]);
    expect(error.code).toBe(2);
    expect(error.stderr).not.toMatch(/[\u001b]/);
    expect(error.stderr).toContain("\\u001b[31m");
  });
});
