/**
 * Tester readings typed quickly, one tube per line or separated by ";":
 * "1: 1600/1550", "2 1480 1500", "3: gas". Section values are separated by
 * "/" or spaces; the words short, leak(age) and gas record failed checks.
 * Readings are Gm in the tester's own unit (µmho on most charts). Pure.
 */
import type { TubeReading } from "../lots/item";

export interface ParsedReadings {
  readings: TubeReading[];
  problems: string[];
}

export function parseReadingsText(text: string, maxTube: number): ParsedReadings {
  const readings: TubeReading[] = [];
  const problems: string[] = [];
  const seen = new Set<number>();
  const parts = text
    .split(/[;\n]+/)
    .map((p) => p.trim())
    .filter(Boolean);
  for (const part of parts) {
    const m = /^(?:tube\s*)?(\d{1,4})\s*[:=.)-]?\s*(.*)$/i.exec(part);
    if (!m) {
      problems.push(`"${part.slice(0, 30)}": start with the tube number`);
      continue;
    }
    const tubeNo = Number(m[1]);
    if (tubeNo < 1 || tubeNo > maxTube) {
      problems.push(`tube ${tubeNo}: this line has tubes 1–${maxTube}`);
      continue;
    }
    if (seen.has(tubeNo)) {
      problems.push(`tube ${tubeNo} is given twice`);
      continue;
    }
    // "1,600" is one number; "at 250 V" is a test condition, not a section.
    const rest = m[2]!.replace(/(\d),(\d{3})(?!\d)/g, "$1$2").replace(/\b\d+(?:\.\d+)?\s*v\b/gi, " ");
    const words = rest.toLowerCase();
    const flags = { shorts: /\bshort/.test(words), leakage: /\bleak/.test(words), gas: /\bgas/.test(words) };
    const values = (rest.match(/\d+(?:\.\d+)?/g) ?? []).map(Number).filter((n) => n > 0 && n <= 100_000);
    if (values.length > 4) {
      problems.push(`tube ${tubeNo}: at most 4 sections`);
      continue;
    }
    if (values.length === 0 && !flags.shorts && !flags.leakage && !flags.gas) {
      problems.push(`tube ${tubeNo}: no reading`);
      continue;
    }
    seen.add(tubeNo);
    readings.push({
      tubeNo,
      measure: "gm",
      sections: values,
      ...(flags.shorts ? { shorts: true } : {}),
      ...(flags.leakage ? { leakage: true } : {}),
      ...(flags.gas ? { gas: true } : {}),
    });
  }
  return { readings, problems };
}

/** The readings back as text, for showing what was read. */
export function readingsToText(readings: readonly TubeReading[]): string {
  return readings
    .map(
      (r) =>
        `${r.tubeNo}: ${[r.sections.join("/"), r.shorts ? "short" : "", r.leakage ? "leakage" : "", r.gas ? "gas" : ""].filter(Boolean).join(" ")}`,
    )
    .join("; ");
}
