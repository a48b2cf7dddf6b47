// decodeDesignation: reads what a type designation says by its scheme [LS53,
// PE], then adds what the house's reference table knows (tapped heaters,
// heater current, base), each step with a reason that carries its source tag.

import type { ReferenceType } from "../reference-row";
import { findReferenceType, type ReferenceTable } from "../reference-table";
import type { HeaterConfiguration } from "../index-types";
import { baseFamilyLabel } from "./base-families";
import { decodeEuropean, decodeMilitary } from "./european-schemes";
import { candidateDesignations, isKnownDesignation } from "./known-names";
import { normaliseDesignation } from "./normalise";
import type { DecodeResult, DecodedDesignation, HeaterInfo, StructuralDecode } from "./types";
import { decodeUsNumeric, decodeUsRma, decodeUsSpecial } from "./us-schemes";

const GT_G = /^[^/]+GT\/G$/;
const SCHEMES = [decodeMilitary, decodeUsSpecial, decodeUsRma, decodeEuropean] as const;

function listedOnly(value: string): StructuralDecode {
  return {
    normalised: value,
    system: "other",
    parts: {},
    heater: { kind: "unknown" },
    electrodes: [],
    coldCathode: false,
    specialQuality: false,
    reasons: [
      "A type in our lists whose name follows neither the US nor the European scheme; nothing is read from the name itself [CTP]",
    ],
  };
}

function formatHeater(volts: number, amps: number): string {
  return `${volts} V ${amps} A`;
}

function heaterFromRow(s: StructuralDecode, row: ReferenceType, reasons: string[]): HeaterInfo {
  const h = row.heater;
  const tag = `[${row.source}]`;
  if (h === undefined) return s.heater;
  if (!h) {
    if (s.heater.kind !== "none") reasons.push(`Reference data: cold cathode, no heater ${tag}`);
    return { kind: "none" };
  }
  const configurations: HeaterConfiguration[] = h.tapped
    ? [
        { volts: h.volts, amps: h.amps, wiring: "halves-in-series" },
        { volts: h.tapped.volts, amps: h.tapped.amps, wiring: "halves-in-parallel" },
      ]
    : [{ volts: h.volts, amps: h.amps, wiring: "single" }];
  if (h.tapped) {
    reasons.push(
      `Reference data: centre-tapped heater, ${formatHeater(h.volts, h.amps)} with halves in series or ${formatHeater(h.tapped.volts, h.tapped.amps)} with halves in parallel; the number names the full series voltage [LS53] ${tag}`,
    );
  } else {
    reasons.push(`Reference data: heater ${formatHeater(h.volts, h.amps)}${h.filament ? " (filament)" : ""} ${tag}`);
  }
  // ECC83 says 6.3 V, 12AX7 says 12.6 V: both are right for a tapped heater.
  const named = s.heater.volts;
  const matching = named === undefined ? undefined : configurations.find((c) => Math.abs(c.volts - named) <= 0.05);
  const range = s.heater.voltsRange;
  const inClass = range !== undefined && configurations.some((c) => c.volts > range[0] && c.volts <= range[1]);
  if (named !== undefined && !matching && !inClass) {
    reasons.push(
      `The designation suggests about ${named} V but the reference data gives ${h.volts} V; the data sheet wins ${tag}`,
    );
  }
  if (s.heater.seriesCurrentMa !== undefined && Math.abs(s.heater.seriesCurrentMa - h.amps * 1000) > 1) {
    reasons.push(
      `Series current ${s.heater.seriesCurrentMa} mA from the letter differs from ${h.amps} A in the reference data ${tag}`,
    );
  }
  const kind = s.heater.kind === "unknown" ? (h.filament && h.volts <= 2 ? "battery" : "voltage") : s.heater.kind;
  const chosen = matching ?? configurations[0];
  return { ...s.heater, kind, volts: chosen.volts, amps: chosen.amps, tapped: Boolean(h.tapped), configurations };
}

function enrich(
  table: ReferenceTable,
  s: StructuralDecode,
): Omit<DecodedDesignation, "ok" | "input" | "knownType" | "candidates" | "changes"> {
  const reasons = [...s.reasons];
  const usNumber = s.system === "us-rma" || s.system === "us-special" || s.system === "us-numeric";
  const found = findReferenceType(table, s.normalised);
  const usable = found && (found.match !== "stem" || usNumber) ? found : undefined;
  if (!usable) {
    if (s.system === "us-rma" && s.parts.heaterCode === "12") {
      reasons.push(
        "A 12-class type may have a centre-tapped heater (12.6 V in series or 6.3 V in parallel); the number alone cannot tell, so check the data sheet [LS53]",
      );
    }
    if (s.system === "us-rma" && s.envelope?.kind === "unspecified" && !s.envelope.suffix) {
      reasons.push(
        "No envelope suffix: on an octal-era type often the original all-metal version, on a miniature plain glass [MEM]",
      );
    }
    return { ...s, reasons };
  }
  const { row, match } = usable;
  reasons.push(
    match === "stem"
      ? `Reference data taken from ${row.designation}, the same type with another suffix [${row.source}]`
      : match === "alias"
        ? `Reference data: listed with ${row.designation}, same heater, base and characteristics [${row.source}]`
        : `Reference data: ${row.designation} [${row.source}]`,
  );
  const heater = heaterFromRow(s, row, reasons);
  const dataBase = { family: row.base, label: baseFamilyLabel(row.base), from: "reference-data" as const };
  let base = s.base;
  if (!base) {
    base = dataBase;
    reasons.push(`Reference data: base ${dataBase.label} [${row.source}]`);
  } else if (base.family !== row.base) {
    reasons.push(
      `The designation suggests ${base.label} but the reference data gives ${dataBase.label}; the data sheet wins [${row.source}]`,
    );
    base = dataBase;
  }
  const loktal = base.family === "loktal" || base.family === "loktal-b10b";
  if (s.system === "us-rma" && loktal && !s.loktal) reasons.push(`Reference data: loktal base [${row.source}]`);
  let envelope = s.envelope;
  if (s.system === "us-rma" && envelope?.kind === "unspecified") {
    if (base.family === "octal") {
      envelope = { ...envelope, kind: "metal-probable" };
      reasons.push("No glass suffix on an octal type: usually the original all-metal version; verify by eye [MEM]");
    } else if (base.family === "noval" || base.family === "miniature-7-pin") {
      envelope = { ...envelope, kind: "glass-miniature" };
      reasons.push("Miniature types are glass; they need no envelope suffix [CTP]");
    }
  }
  return {
    ...s,
    heater,
    base,
    ...(envelope ? { envelope } : {}),
    loktal,
    coldCathode: row.heater === null || s.coldCathode,
    reference: { designation: row.designation, match },
    reasons,
  };
}

/**
 * Decodes a type designation. Cleans it with normaliseDesignation, reads it as
 * a military, four-digit EIA, US RMA or European number (in that order), and
 * adds the reference table's data where it has the type. Names that follow no scheme are
 * accepted only when they are in our lists (KT88, 83). Unknown but well-formed
 * designations decode, with `knownType: false` and close known candidates;
 * malformed ones fail with a reason and candidates.
 */
export function decodeDesignation(table: ReferenceTable, input: string): DecodeResult {
  const n = normaliseDesignation(input);
  if (!n.ok) return { ok: false, input, error: n.error, message: n.message, candidates: [] };
  const value = n.value;
  const fail = (message: string): DecodeResult => ({
    ok: false,
    input,
    normalised: value,
    error: "not-a-designation",
    message,
    candidates: candidateDesignations(table, value),
  });
  if (value.includes("/") && !GT_G.test(value)) {
    return fail(
      '"/" joins two designations, or is a mistyped suffix; enter one designation (GT/G is the only suffix with "/").',
    );
  }
  const known = isKnownDesignation(table, value);
  let structural: StructuralDecode | undefined;
  let refusal: string | undefined;
  for (const decode of SCHEMES) {
    const r = decode(value);
    if (!r) continue;
    if ("refused" in r) {
      refusal ??= r.message;
      continue;
    }
    structural = r;
    break;
  }
  if (!structural && known) structural = decodeUsNumeric(value) ?? listedOnly(value);
  if (!structural) {
    if (refusal) return fail(refusal);
    if (decodeUsNumeric(value))
      return fail("Bare numbers (early or transmitting types) are accepted only for types in our lists.");
    return fail("This follows neither the US nor the European numbering scheme.");
  }
  const decoded = enrich(table, structural);
  // On file: listed by name or alias, or an unlisted suffix of a listed US number (5814 -> 5814A).
  const knownType = known || decoded.reference !== undefined;
  return {
    ok: true,
    input,
    ...decoded,
    knownType,
    candidates: knownType ? [] : candidateDesignations(table, value),
    changes: n.changes,
  };
}
