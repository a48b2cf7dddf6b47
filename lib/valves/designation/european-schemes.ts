// Structural decoders for European designations (ECC83, and the special-quality
// order E88CC) and military register numbers (CV4004, VT231).

import { baseFamilyLabel } from "./base-families";
import { EUROPEAN_HEATER_LETTERS, EUROPEAN_SYSTEM_LETTERS, readEuropeanDigits } from "./european-tables";
import type { ElectrodeSystem, HeaterInfo, StructuralDecode, StructuralRefusal } from "./types";

const EUROPEAN = /^([A-Z])([A-Z]{1,4})(\d{2,3})([A-Z]?)$/;
const EUROPEAN_SPECIAL = /^([A-Z])(\d{2,3})([A-Z]{1,4})$/;
const CV = /^CV(\d{1,5})$/;
const VT = /^VT(\d{1,3})([A-Z]?)$/;

function heaterFromLetter(letter: string): { heater: HeaterInfo; reason: string } | undefined {
  const entry = EUROPEAN_HEATER_LETTERS[letter];
  if (!entry) return undefined;
  const heater: HeaterInfo = {
    kind: entry.kind,
    ...(entry.volts !== undefined ? { volts: entry.volts } : {}),
    ...(entry.seriesCurrentMa !== undefined ? { seriesCurrentMa: entry.seriesCurrentMa } : {}),
  };
  return { heater, reason: `First letter ${letter}: heater ${entry.label} [${entry.source}]` };
}

function systemsFromLetters(letters: string): { electrodes: ElectrodeSystem[]; bad: string[] } {
  const electrodes: ElectrodeSystem[] = [];
  const bad: string[] = [];
  for (const letter of letters) {
    const entry = EUROPEAN_SYSTEM_LETTERS[letter];
    if (entry) electrodes.push({ letter, system: entry.system, source: entry.source });
    else if (!bad.includes(letter)) bad.push(letter);
  }
  return { electrodes, bad };
}

function decodeEuropeanParts(
  value: string,
  heaterLetter: string,
  letters: string,
  digits: string,
  special: boolean,
  trailing: string,
): StructuralDecode | StructuralRefusal | undefined {
  const heater = heaterFromLetter(heaterLetter);
  const { electrodes, bad } = systemsFromLetters(letters);
  if (!heater) {
    // Not a European heater letter: the shape may still fit another scheme.
    return undefined;
  }
  if (bad.length > 0) {
    return {
      refused: true,
      message: `${bad.join(", ")} ${bad.length === 1 ? "is not a" : "are not"} European system letter${bad.length === 1 ? "" : "s"} [PE].`,
    };
  }
  const reasons = [heater.reason];
  for (const e of electrodes) reasons.push(`System letter ${e.letter}: ${e.system} [${e.source}]`);
  const sorted = [...letters].sort().join("");
  if (sorted !== letters) {
    reasons.push(`System letters "${letters}" are not in the usual alphabetical order [PE]; check the marking`);
  }
  const base = readEuropeanDigits(digits);
  reasons.push(`Digits ${digits}: ${base.reason}`);
  if (special) {
    reasons.push(
      "Digits placed between the heater and system letters: special-quality (long-life, industrial) version [PE]",
    );
  }
  if (trailing) {
    reasons.push(`Trailing letter ${trailing}: a variant mark with no scheme-wide meaning [MEM]`);
  }
  return {
    normalised: value,
    system: special ? "european-special" : "european",
    parts: { heaterCode: heaterLetter, letters, number: digits, ...(trailing ? { suffix: trailing } : {}) },
    heater: heater.heater,
    electrodes,
    ...(base.family
      ? { base: { family: base.family, label: baseFamilyLabel(base.family), from: "designation" as const } }
      : {}),
    ...(base.family ? { loktal: base.family === "loktal-b10b" } : {}),
    coldCathode: false,
    specialQuality: special,
    reasons,
  };
}

/**
 * Decodes a European designation [PE]: heater letter, one or more system
 * letters (each decoded), then base digits; or the special-quality order with
 * the digits inside (E88CC, E83CC, E80F). Returns undefined when the shape does
 * not fit, or a refusal when a system letter does not exist.
 */
export function decodeEuropean(value: string): StructuralDecode | StructuralRefusal | undefined {
  const normal = EUROPEAN.exec(value);
  if (normal) return decodeEuropeanParts(value, normal[1], normal[2], normal[3], false, normal[4]);
  const special = EUROPEAN_SPECIAL.exec(value);
  if (special) return decodeEuropeanParts(value, special[1], special[3], special[2], true, "");
  return undefined;
}

/**
 * Decodes a military register number: UK CV numbers (CV4004) and US VT
 * numbers (VT231). Both are register numbers with no heater or base meaning [MEM].
 */
export function decodeMilitary(value: string): StructuralDecode | undefined {
  const cv = CV.exec(value);
  if (cv) {
    return {
      normalised: value,
      system: "military-cv",
      parts: { prefix: "CV", number: cv[1] },
      heater: { kind: "unknown" },
      electrodes: [],
      coldCathode: false,
      specialQuality: true,
      reasons: [
        "CV number: a UK military register number, often a special-quality version of a commercial type; no heater or base meaning [MEM]",
      ],
    };
  }
  const vt = VT.exec(value);
  if (vt) {
    return {
      normalised: value,
      system: "military-vt",
      parts: { prefix: "VT", number: vt[1], ...(vt[2] ? { suffix: vt[2] } : {}) },
      heater: { kind: "unknown" },
      electrodes: [],
      coldCathode: false,
      specialQuality: true,
      reasons: ["VT number: a US military register number; no heater or base meaning [MEM]"],
    };
  }
  return undefined;
}
