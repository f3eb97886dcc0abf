import * as fs from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, afterEach, describe, expect, it, vi } from "vitest";
import { InputError } from "../../src/io/InputError.js";
import { writeOutputFile } from "../../src/io/writeOutputFile.js";

// Pass-through spies, so single calls can be made to fail as a full disk or a crash would.
vi.mock("node:fs", async (importOriginal) => {
  const actual = await importOriginal<typeof import("node:fs")>();
  return { ...actual, renameSync: vi.fn(actual.renameSync), linkSync: vi.fn(actual.linkSync), writeSync: vi.fn(actual.writeSync) };
});

const scratch = fs.mkdtempSync(join(tmpdir(), "averta-write-"));
afterAll(() => fs.rmSync(scratch, { recursive: true, force: true }));
afterEach(() => {
  vi.mocked(fs.renameSync).mockClear();
  vi.mocked(fs.linkSync).mockClear();
});

let counter = 0;
function freshFolder(): string {
  const folder = join(scratch, `case-${++counter}`);
  fs.mkdirSync(folder);
  return folder;
}

describe("writeOutputFile", () => {
  it("writes the whole content through a temporary file in the same folder, then links it to a name still free", () => {
    const folder = freshFolder();
    const target = join(folder, "plan.json");
    const content = "x".repeat(100_000);
    vi.mocked(fs.linkSync).mockImplementationOnce((from, to) => {
      // At the moment of publishing the target does not exist yet and the temporary file is complete.
      expect(fs.existsSync(target)).toBe(false);
      expect(join(String(from), "..")).toBe(folder);
      expect(fs.readFileSync(from, "utf8")).toBe(content);
      expect(to).toBe(target);
      fs.writeFileSync(String(to), fs.readFileSync(from));
    });
    writeOutputFile(target, content, false);
    expect(vi.mocked(fs.linkSync)).toHaveBeenCalledTimes(1);
    expect(vi.mocked(fs.renameSync)).not.toHaveBeenCalled();
    expect(fs.readFileSync(target, "utf8")).toBe(content);
    expect(fs.readdirSync(folder)).toEqual(["plan.json"]);
  });

  it("writes to its end when the system writes only part of a buffer at a time", () => {
    const folder = freshFolder();
    const target = join(folder, "big.csv");
    const content = "0123456789".repeat(10_000);
    const actual = vi.mocked(fs.writeSync).getMockImplementation()!;
    const write = actual as unknown as (fd: number, buffer: Uint8Array, offset: number, length: number) => number;
    // A full pipe or a signal can make each write take fewer bytes than asked.
    vi.mocked(fs.writeSync).mockImplementation(((fd: number, buffer: Uint8Array, offset: number, length: number) => write(fd, buffer, offset, Math.min(length, 777))) as typeof fs.writeSync);
    try {
      writeOutputFile(target, content, false);
    } finally {
      vi.mocked(fs.writeSync).mockImplementation(actual);
    }
    expect(fs.readFileSync(target, "utf8")).toBe(content);
  });

  it("leaves an existing file untouched without force, and says how to replace it", () => {
    const folder = freshFolder();
    const target = join(folder, "plan.csv");
    fs.writeFileSync(target, "the user's own file");
    let caught: unknown;
    try {
      writeOutputFile(target, "new", false);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(InputError);
    expect((caught as InputError).code).toBe("exists");
    expect((caught as InputError).problems[0]!.hint).toContain("--force");
    expect(fs.readFileSync(target, "utf8")).toBe("the user's own file");
    expect(fs.readdirSync(folder)).toEqual(["plan.csv"]);
  });

  it("replaces an existing file with force", () => {
    const folder = freshFolder();
    const target = join(folder, "plan.csv");
    fs.writeFileSync(target, "old");
    writeOutputFile(target, "new", true);
    expect(fs.readFileSync(target, "utf8")).toBe("new");
    expect(fs.readdirSync(folder)).toEqual(["plan.csv"]);
  });

  it("a failing write leaves neither the target nor the temporary file", () => {
    const folder = freshFolder();
    vi.mocked(fs.writeSync).mockImplementationOnce(() => {
      throw Object.assign(new Error("no space left on device"), { code: "ENOSPC" });
    });
    expect(() => writeOutputFile(join(folder, "plan.json"), "{}", false)).toThrow("no space left");
    expect(fs.readdirSync(folder)).toEqual([]);
  });

  it("a failing publish leaves neither the target nor the temporary file", () => {
    const folder = freshFolder();
    vi.mocked(fs.linkSync).mockImplementationOnce(() => {
      throw Object.assign(new Error("input/output error"), { code: "EIO" });
    });
    expect(() => writeOutputFile(join(folder, "plan.json"), "{}", false)).toThrow("input/output error");
    expect(fs.readdirSync(folder)).toEqual([]);
  });

  it("a failing rename under --force keeps the user's previous file intact", () => {
    const folder = freshFolder();
    const target = join(folder, "plan.json");
    fs.writeFileSync(target, "previous");
    vi.mocked(fs.renameSync).mockImplementationOnce(() => {
      throw Object.assign(new Error("input/output error"), { code: "EIO" });
    });
    expect(() => writeOutputFile(target, "replacement", true)).toThrow();
    expect(fs.readFileSync(target, "utf8")).toBe("previous");
    expect(fs.readdirSync(folder)).toEqual(["plan.json"]);
  });

  it("a folder the user may not write to is bad input naming the path, not an internal fault", () => {
    const folder = freshFolder();
    vi.mocked(fs.writeSync).mockImplementationOnce(() => {
      throw Object.assign(new Error("permission denied"), { code: "EACCES" });
    });
    let caught: unknown;
    try {
      writeOutputFile(join(folder, "chart.svg"), "<svg/>", false, "--chart");
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(InputError);
    expect((caught as InputError).code).toBe("cannot-write");
    expect((caught as InputError).problems[0]!.hint).toContain("--chart");
    expect(fs.readdirSync(folder)).toEqual([]);
  });

  it("an empty file name is bad input, not a failed rename", () => {
    expect(() => writeOutputFile("", "{}", false)).toThrow(InputError);
    expect(() => writeOutputFile("  ", "{}", false)).toThrow(InputError);
  });

  it("refuses a folder that does not exist, as bad input", () => {
    expect(() => writeOutputFile(join(scratch, "no-such-folder", "plan.json"), "{}", false)).toThrow(InputError);
  });
});
