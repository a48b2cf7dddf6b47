// Seed rows: US series-string types of table radios and TV sets. A 150 mA
// radio set runs 12BE6 + 12BA6 + 12AV6 + 50C5 + 35W4 (12.6 × 3 + 50 + 35 ≈
// 123 V) from the mains; the later 100 mA set runs 18FX6 + 18FW6 + 18FY6 +
// 34GD5 + 36AM3 (18 × 3 + 34 + 36 = 124 V) [REG MEM]. The first number is
// the heater voltage [LS53].

import type { ReferenceType } from "../reference-row";
import { H, T } from "./builders";

const low = { source: "REG MEM?" } as const;

export const SERIES_STRING_ROWS: readonly ReferenceType[] = [
  // 150 mA.
  T("35B5", "beam-tetrode", H(35, 0.15), "miniature-7-pin"),
  T("35C5", "beam-tetrode", H(35, 0.15), "miniature-7-pin"),
  T("50B5", "beam-tetrode", H(50, 0.15), "miniature-7-pin"),
  T("35L6GT", "beam-tetrode", H(35, 0.15), "octal"),
  T("50L6GT", "beam-tetrode", H(50, 0.15), "octal"),
  T("35A5", "beam-tetrode", H(35, 0.15), "loktal", low),
  T("50A5", "beam-tetrode", H(50, 0.15), "loktal", low),
  T("35Z5GT", "half-wave-rectifier", H(35, 0.15), "octal", { note: "Tapped heater feeds a pilot lamp" }),
  T("35Z4GT", "half-wave-rectifier", H(35, 0.15), "octal"),
  T("35Z3", "half-wave-rectifier", H(35, 0.15), "loktal", low),
  T("35Y4", "half-wave-rectifier", H(35, 0.15), "loktal", low),
  // 300 mA and line-voltage rectifiers.
  T("25L6GT", "beam-tetrode", H(25, 0.3), "octal"),
  T("25Z6GT", "full-wave-rectifier", H(25, 0.3), "octal", { note: "Two diodes, often used as a voltage doubler" }),
  T("25Z5", "full-wave-rectifier", H(25, 0.3), "pre-octal"),
  T("43", "power-pentode", H(25, 0.3), "pre-octal"),
  T("117Z3", "half-wave-rectifier", H(117, 0.04), "miniature-7-pin"),
  T("117Z6GT", "full-wave-rectifier", H(117, 0.075), "octal", low),
  // 100 mA.
  T("18FW6A", "remote-cutoff-pentode", H(18, 0.1), "miniature-7-pin", { aliases: ["18FW6"], ...low }),
  T("18FX6", "pentagrid-converter", H(18, 0.1), "miniature-7-pin", { aliases: ["18FX6A"], ...low }),
  T("18FY6", "duo-diode-triode", H(18, 0.1), "miniature-7-pin", { aliases: ["18FY6A"], ...low }),
  T("34GD5", "beam-tetrode", H(34, 0.1), "miniature-7-pin", { aliases: ["34GD5A"], ...low }),
  T("36AM3", "half-wave-rectifier", H(36, 0.1), "miniature-7-pin", { aliases: ["36AM3A", "36AM3B"], ...low }),
  // 600 mA TV strings (3.15 V heaters at 0.6 A).
  T("3AU6", "pentode", H(3.15, 0.6), "miniature-7-pin", low),
  T("3BZ6", "remote-cutoff-pentode", H(3.15, 0.6), "miniature-7-pin", low),
  T("3CB6", "pentode", H(3.15, 0.6), "miniature-7-pin", low),
];
