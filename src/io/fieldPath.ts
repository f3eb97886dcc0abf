import type { PathSegment } from "./readYamlFile.js";

/** Renders ["sites", 3, "candidates", 1] as "sites[3].candidates[1]". */
export function formatFieldPath(path: readonly PathSegment[]): string {
  return path
    .map((segment, index) => (typeof segment === "number" ? `[${segment}]` : index === 0 ? segment : `.${segment}`))
    .join("");
}

/** Parses an ajv instance path ("/sites/3/name") into segments, numbers for array indexes. */
export function parseJsonPointer(pointer: string): PathSegment[] {
  if (pointer === "") return [];
  return pointer
    .slice(1)
    .split("/")
    .map((raw) => raw.replace(/~1/g, "/").replace(/~0/g, "~"))
    .map((segment) => (/^\d+$/.test(segment) ? Number(segment) : segment));
}
