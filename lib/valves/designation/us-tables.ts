// Tables for US RMA/RETMA/EIA receiving-tube numbers.

import type { EnvelopeInfo, HeaterInfo } from "./types";

/** Heater meaning of the first number of a US type, with the reasons that support it. */
export interface UsHeaterReading {
  readonly heater: HeaterInfo;
  /** true when the number implies a loktal base (7 or 14 with one serial letter). */
  readonly loktal?: boolean;
  readonly reasons: readonly string[];
}

/**
 * Reads the heater class from the first number [LS53]: 0 cold cathode, 1 up to
 * 2.0 V (1.4 V types, and the earlier 2.0 V battery types [MEM]), 5 = 4.6-5.6 V, 6 = 5.6-6.6 V, 12 = 12.6 V. 6.3 V loktals carry 7 [LS53]
 * and 12.6 V loktals 14 [MEM]; we take a single serial letter as the loktal
 * sign (7N7, 7A8) and two letters as a later series-string type (7DJ8) [MEM].
 */
export function readUsHeaterNumber(n: number, letters: string): UsHeaterReading {
  const singleLetter = letters.length === 1;
  switch (n) {
    case 0:
      return {
        heater: { kind: "none" },
        reasons: ["First number 0: cold-cathode type, no heater [LS53]"],
      };
    case 1:
      return {
        heater: { kind: "battery", volts: 1.4, voltsRange: [0, 2] },
        reasons: [
          "First number 1: heater or filament above 0 and up to 1.6 V for the 1.4 V battery types [LS53]; earlier 2.0 V battery types (1A6, 1C6, 1F4) also carry 1, so the class runs to 2.0 V [MEM]",
        ],
      };
    case 5:
      return {
        heater: { kind: "voltage", volts: 5, voltsRange: [4.6, 5.6] },
        reasons: ["First number 5: heater class 4.6-5.6 V, nominally 5 V [LS53]"],
      };
    case 6:
      return {
        heater: { kind: "voltage", volts: 6.3, voltsRange: [5.6, 6.6] },
        reasons: ["First number 6: heater class 5.6-6.6 V, nominally 6.3 V [LS53]"],
      };
    case 7:
      return singleLetter
        ? {
            heater: { kind: "voltage", volts: 6.3 },
            loktal: true,
            reasons: [
              "First number 7 with one serial letter: a 6.3 V loktal numbered 7, not a 7 V heater [LS53]",
              "Reading a single letter as the loktal sign is a rule of thumb; reference data confirms it where we have it [MEM]",
            ],
          }
        : {
            heater: { kind: "voltage", volts: 7 },
            reasons: ["First number 7 with two serial letters: about 7 V, usually a series-string type [MEM]"],
          };
    case 12:
      return {
        heater: { kind: "voltage", volts: 12.6 },
        reasons: ["First number 12: heater class 12.6 V [LS53]"],
      };
    case 14:
      return singleLetter
        ? {
            heater: { kind: "voltage", volts: 12.6 },
            loktal: true,
            reasons: ["First number 14 with one serial letter: a 12.6 V loktal, not a 14 V heater [MEM]"],
          }
        : {
            heater: { kind: "voltage", volts: 14 },
            reasons: ["First number 14 with two serial letters: about 14 V [MEM]"],
          };
    default:
      return {
        heater: { kind: "voltage", volts: n },
        reasons: [
          n >= 17
            ? `First number ${n}: about ${n} V, a series-string heater (25, 35, 50 classes) [MEM]`
            : `First number ${n}: heater of about ${n} V [MEM]`,
        ],
      };
  }
}

/** What the serial letters hint at, beyond the heater (single-ended S, battery loktal L, rectifier range). */
export interface UsLetterReading {
  readonly singleEnded: boolean;
  readonly batteryLoktal: boolean;
  readonly reasons: readonly string[];
}

/**
 * Serial letters [LS53]: issued in order, skipping I and O; rectifiers were
 * allocated backwards from Z, so a single U-Z often (not always: 6V6) means a
 * rectifier. A two-letter group starting with S marks a single-ended type
 * (6SK7 is the single-ended 6K7) [LS53]; a leading L on a battery type is a
 * battery loktal [LS53, MEM].
 */
export function readUsLetters(n: number, letters: string): UsLetterReading {
  const reasons: string[] = ["Serial letters are issued in order and carry no electrical meaning on their own [LS53]"];
  const singleEnded = letters.length === 2 && letters[0] === "S";
  if (singleEnded) reasons.push(`Leading S in "${letters}": single-ended, no top cap [LS53]`);
  const batteryLoktal = letters.length === 2 && letters[0] === "L" && n === 1;
  if (batteryLoktal) reasons.push(`Leading L in "${letters}" on a battery type: battery loktal [LS53, MEM]`);
  if (letters.length === 1 && letters >= "U" && letters <= "Z") {
    reasons.push(
      `Single letter ${letters}: rectifiers were allocated backwards from Z, so often a rectifier, not always [LS53]`,
    );
  }
  return { singleEnded, batteryLoktal, reasons };
}

// Suffix grammar: optional W, glass style (G, GT, GT/G), improvement letter,
// later ruggedised W/WA/WB, then a base-material or metal letter [MEM].
const SUFFIX = /^(W)?(GT\/G|GT|G)?([A-F])?(W[A-C]?)?([XYM])?$/;

/** Reads a US suffix; undefined when the suffix does not follow the grammar. */
export function readUsSuffix(suffix: string): { envelope: EnvelopeInfo; reasons: string[] } | undefined {
  const m = SUFFIX.exec(suffix);
  if (!m) return undefined;
  const [, leadW, glass, improvement, laterW, material] = m;
  const reasons: string[] = [];
  let kind: EnvelopeInfo["kind"] = "unspecified";
  if (glass === "GT/G") {
    kind = "glass-tubular-or-shouldered";
    reasons.push("Suffix GT/G: interchangeable with both the G and GT versions [MEM]");
  } else if (glass === "GT") {
    kind = "glass-tubular";
    reasons.push("Suffix GT: glass tubular (straight) bulb [MEM]");
  } else if (glass === "G") {
    kind = "glass-shouldered";
    reasons.push("Suffix G: glass, shouldered bulb [MEM]");
  }
  if (material === "M") {
    kind = "metal";
    reasons.push("Suffix M: metal envelope [MEM]");
  }
  // "WA"/"WB" right after the serial number: a later ruggedised version [MEM].
  const laterRugged = leadW !== undefined && glass === undefined && improvement !== undefined;
  if (improvement && !laterRugged) {
    reasons.push(
      glass === "GT"
        ? `Suffix GT${improvement}: improved GT (controlled heater warm-up for series strings and/or higher ratings) [MEM]`
        : `Improvement letter ${improvement}: improved, backward-compatible version; a later suffix normally replaces an earlier one, not necessarily the reverse [MEM]`,
    );
  }
  const w = leadW ?? laterW;
  if (laterRugged) {
    reasons.push(`Suffix W${improvement}: later ruggedised (military/industrial) version of the W [MEM]`);
  } else if (laterW && laterW.length > 1) {
    reasons.push(`Suffix ${laterW}: later ruggedised (military/industrial) version of the W [MEM]`);
  } else if (w) {
    reasons.push("Suffix W: ruggedised (military) version [MEM]");
  }
  let baseMaterial: EnvelopeInfo["baseMaterial"];
  if (material === "Y") {
    baseMaterial = "low-loss-phenolic";
    reasons.push("Suffix Y: low-loss phenolic base [MEM]");
  } else if (material === "X") {
    baseMaterial = "low-loss-ceramic";
    reasons.push("Suffix X: low-loss ceramic base [MEM]");
  }
  const improvementLetter = improvement ?? (laterW && laterW.length > 1 ? laterW.slice(1) : undefined);
  return {
    envelope: {
      kind,
      suffix,
      ruggedised: Boolean(w),
      ...(improvementLetter ? { improvement: improvementLetter } : {}),
      ...(baseMaterial ? { baseMaterial } : {}),
    },
    reasons,
  };
}
