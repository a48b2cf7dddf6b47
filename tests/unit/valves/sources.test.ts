// Every source tag a test cites is listed, with its publication, in lib/valves/sources.ts.
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { describeRowSource, parseRowSource, SOURCE_TAGS } from "@/lib/valves/sources";

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? files(p) : p.endsWith(".ts") ? [p] : [];
  });
}

describe("source tags", () => {
  it("every tag cited in a test comment or title is in the sources list, and none cites the internal brief", () => {
    const unknown = new Set<string>();
    for (const f of [...files("tests/unit"), ...files("tests/integration")]) {
      for (const line of readFileSync(f, "utf8").split("\n")) {
        const cited = line.match(/(?:\/\/|\b(?:it|describe|it\.each\([^)]*\))\().*/)?.[0] ?? "";
        for (const m of cited.matchAll(/\[([A-Z][A-Z0-9-]+)/g))
          if (!SOURCE_TAGS.includes(m[1]!)) unknown.add(`${f}: ${m[1]}`);
        if (/brief\s*(§|section|\d)/.test(line) && !f.includes("escrow")) unknown.add(`${f}: cites the brief`);
      }
    }
    expect([...unknown]).toEqual([]);
  });

  it("reads row sources into tags and marks", () => {
    expect(parseRowSource("REG ✓")).toEqual({ tags: ["REG"], mark: "checked" });
    expect(parseRowSource("MIL-E-1/REG MEM?")).toEqual({ tags: ["MIL-E-1", "REG"], mark: "memory-low" });
    expect(parseRowSource("MEM")).toEqual({ tags: [], mark: "memory" });
    expect(parseRowSource("CTP")).toEqual({ tags: ["CTP"], mark: "stated" });
    expect(parseRowSource("HANDBOOK")).toBeUndefined();
    expect(describeRowSource("EU-DS MEM")).toBe("EU-DS, from memory (verify)");
  });
});
