// Structural decoders for US designations: RMA numbers (6SN7GT), four-digit
// EIA registrations (5751) and early or transmitting numbers (83, 866A).

import { baseFamilyLabel } from "./base-families";
import { readUsHeaterNumber, readUsLetters, readUsSuffix } from "./us-tables";
import type { StructuralDecode, StructuralRefusal } from "./types";

const RMA = /^(\d{1,3})([A-Z]{1,2})(\d{1,2})([A-Z/]*)$/;
const SPECIAL = /^(\d{4})([A-Z/]{0,4})$/;
const NUMERIC = /^(\d{1,3})([A-Z]?)$/;

/**
 * Decodes an RMA/RETMA/EIA receiving-tube number: heater class, serial
 * letters, element count and suffix [LS53, MEM]. Returns undefined when the
 * shape does not fit, or a refusal when it fits but cannot be a real number.
 */
export function decodeUsRma(value: string): StructuralDecode | StructuralRefusal | undefined {
  const m = RMA.exec(value);
  if (!m) return undefined;
  const [, numberText, letters, elementsText, suffix] = m;
  if (/[IO]/.test(letters)) {
    return {
      refused: true,
      message: `US serial letters skip I and O [LS53]; "${letters}" cannot occur (did you mean 1 or 0?).`,
    };
  }
  const suffixReading = readUsSuffix(suffix);
  if (suffix && !suffixReading) {
    return {
      refused: true,
      message: `"${suffix}" is not a US suffix we recognise (G, GT, GT/G, A, B, W, WA, Y, X, M...).`,
    };
  }
  const n = Number(numberText);
  const heaterReading = readUsHeaterNumber(n, letters);
  const letterReading = readUsLetters(n, letters);
  const elementCount = Number(elementsText);
  if (elementCount === 0 || elementCount > 12) {
    return {
      refused: true,
      message: `A final number of ${elementCount} does not occur: it counts the useful elements brought out, from 1 up to 12 on the largest (compactron) bases [MEM].`,
    };
  }
  const reasons = [
    ...heaterReading.reasons,
    ...letterReading.reasons,
    `Final number ${elementCount}: useful elements brought out; loosely applied, never derive a pinout from it [MEM]`,
    ...(suffixReading?.reasons ?? []),
  ];
  const loktal = heaterReading.loktal || letterReading.batteryLoktal || undefined;
  return {
    normalised: value,
    system: "us-rma",
    parts: { heaterCode: numberText, letters, number: elementsText, ...(suffix ? { suffix } : {}) },
    heater: heaterReading.heater,
    electrodes: [],
    ...(loktal
      ? { base: { family: "loktal" as const, label: baseFamilyLabel("loktal"), from: "designation" as const } }
      : {}),
    envelope: suffixReading?.envelope ?? { kind: "unspecified", suffix: "", ruggedised: false },
    singleEnded: letterReading.singleEnded,
    ...(loktal !== undefined ? { loktal } : {}),
    coldCathode: n === 0,
    elementCount,
    specialQuality: Boolean(suffixReading?.envelope.ruggedised),
    reasons,
  };
}

/**
 * Decodes a four-digit EIA registration (5751, 5814A, 6189, 7025): sequential
 * special-quality, industrial or military numbers with no heater meaning [MEM].
 * A suffix (A, WA...) is read with the US suffix rules.
 */
export function decodeUsSpecial(value: string): StructuralDecode | StructuralRefusal | undefined {
  const m = SPECIAL.exec(value);
  if (!m) return undefined;
  const [, numberText, suffix] = m;
  const suffixReading = readUsSuffix(suffix);
  if (suffix && !suffixReading) {
    return { refused: true, message: `"${suffix}" is not a suffix we recognise on a four-digit registration.` };
  }
  return {
    normalised: value,
    system: "us-special",
    parts: { number: numberText, ...(suffix ? { suffix } : {}) },
    heater: { kind: "unknown" },
    electrodes: [],
    ...(suffixReading && suffix ? { envelope: suffixReading.envelope } : {}),
    coldCathode: false,
    specialQuality: true,
    reasons: [
      `Four-digit number ${numberText}: a sequential EIA special-quality, industrial or military registration; the first digit says nothing about the heater [MEM]`,
      ...(suffixReading?.reasons ?? []),
    ],
  };
}

/**
 * Decodes a bare early or transmitting number (80, 83, 807, 866A, 300B).
 * These carry no heater or base meaning; the caller accepts them only for
 * types in our lists [MEM].
 */
export function decodeUsNumeric(value: string): StructuralDecode | undefined {
  const m = NUMERIC.exec(value);
  if (!m) return undefined;
  const [, numberText, suffix] = m;
  return {
    normalised: value,
    system: "us-numeric",
    parts: { number: numberText, ...(suffix ? { suffix } : {}) },
    heater: { kind: "unknown" },
    electrodes: [],
    coldCathode: false,
    specialQuality: false,
    reasons: [
      `Bare number ${numberText}: an early sequential or transmitting-type number with no heater or base meaning [MEM]`,
      ...(suffix ? [`Letter ${suffix}: a later or improved version of the numbered type [MEM]`] : []),
    ],
  };
}
