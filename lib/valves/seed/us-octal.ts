// Seed rows: US octal and loktal receiving, audio and TV types. Heater and
// base from registered figures [REG], recalled from memory (MEM); "MEM?"
// where confidence is low. Characteristics left empty unless known.

import type { ReferenceType } from "../reference-row";
import { H, T } from "./builders";

const low = { source: "REG MEM?" } as const;
const big = { largeEnvelope: true } as const;

export const US_OCTAL_ROWS: readonly ReferenceType[] = [
  // Octal small-signal, 6.3 V.
  T("6A8", "pentagrid-converter", H(6.3, 0.3), "octal", { aliases: ["6A8G", "6A8GT"] }),
  T("6AC7", "pentode", H(6.3, 0.45), "octal"),
  T("6AG7", "power-pentode", H(6.3, 0.65), "octal"),
  T("6B8", "duo-diode-pentode", H(6.3, 0.3), "octal", { aliases: ["6B8G"] }),
  T("6C5", "triode", H(6.3, 0.3), "octal", { aliases: ["6C5G", "6C5GT"] }),
  T("6C8G", "dual-triode", H(6.3, 0.3), "octal", low),
  T("6F5", "triode", H(6.3, 0.3), "octal", { aliases: ["6F5G", "6F5GT"] }),
  T("6F8G", "dual-triode", H(6.3, 0.6), "octal", { note: "Top-cap grid; similar to 6SN7GT on another base" }),
  T("6H6", "twin-diode", H(6.3, 0.3), "octal", { aliases: ["6H6G", "6H6GT"] }),
  T("6J7", "pentode", H(6.3, 0.3), "octal", { aliases: ["6J7G", "6J7GT"] }),
  T("6K7", "remote-cutoff-pentode", H(6.3, 0.3), "octal", { aliases: ["6K7G", "6K7GT"] }),
  T("6K8", "triode-hexode", H(6.3, 0.3), "octal", { aliases: ["6K8G", "6K8GT"] }),
  T("6L7", "pentagrid-converter", H(6.3, 0.3), "octal", low),
  T("6N7", "dual-power-triode", H(6.3, 0.8), "octal", { aliases: ["6N7G", "6N7GT"] }),
  T("6Q7", "duo-diode-triode", H(6.3, 0.3), "octal", { aliases: ["6Q7G", "6Q7GT"] }),
  T("6SA7", "pentagrid-converter", H(6.3, 0.3), "octal", { aliases: ["6SA7GT"] }),
  T("6SB7Y", "pentagrid-converter", H(6.3, 0.3), "octal", low),
  T("6SC7", "dual-triode", H(6.3, 0.3), "octal"),
  T("6SF5", "triode", H(6.3, 0.3), "octal", { aliases: ["6SF5GT"] }),
  T("6SG7", "remote-cutoff-pentode", H(6.3, 0.3), "octal"),
  T("6SH7", "pentode", H(6.3, 0.3), "octal"),
  T("6SR7", "duo-diode-triode", H(6.3, 0.3), "octal"),
  T("6AF6G", "tuning-indicator", H(6.3, 0.15), "octal", low),
  // Octal output, 6.3 V.
  T("6B4G", "power-triode", H(6.3, 1, true), "octal", {
    ...big,
    note: "Directly heated; a 2A3 on an octal base with a 6.3 V filament",
  }),
  T("6BG6GA", "beam-tetrode", H(6.3, 0.9), "octal", { aliases: ["6BG6G"] }),
  T("6W6GT", "beam-tetrode", H(6.3, 1.2), "octal"),
  T("6Y6GA", "beam-tetrode", H(6.3, 1.25), "octal", { aliases: ["6Y6G"] }),
  T("6146", "beam-tetrode", H(6.3, 1.25), "octal", {
    aliases: ["6146A"],
    note: "Plate on a top cap: high voltage at the cap",
  }),
  T("7581A", "beam-tetrode", H(6.3, 0.9), "octal", { aliases: ["7581"], ...low }),
  T("7591A", "beam-tetrode", H(6.3, 0.8), "octal", { aliases: ["7591"], ...low }),
  T("KT77", "beam-tetrode", H(6.3, 1.4), "octal", {
    ...big,
    source: "EU-DS MEM?",
    note: "Substitutes for EL34 with caveats",
  }),
  T("6BL7GTA", "dual-triode", H(6.3, 1.5), "octal", { aliases: ["6BL7GT"] }),
  T("6BX7GT", "dual-triode", H(6.3, 1.5), "octal"),
  T("6080", "dual-power-triode", H(6.3, 2.5), "octal", { ...big, source: "MIL-E-1/REG MEM", note: "Ruggedised 6AS7G" }),
  // TV sweep and dampers.
  T("6AU4GTA", "damper-diode", H(6.3, 1.8), "octal", { aliases: ["6AU4GT"] }),
  T("6AX4GTB", "damper-diode", H(6.3, 1.2), "octal", { aliases: ["6AX4GT", "6AX4GTA"] }),
  T("6W4GT", "damper-diode", H(6.3, 1.2), "octal"),
  T("12AX4GTB", "damper-diode", H(12.6, 0.6), "octal", { aliases: ["12AX4GTA"] }),
  T("6BQ6GTB", "beam-tetrode", H(6.3, 1.2), "octal", {
    aliases: ["6BQ6GT", "6CU6"],
    note: "Horizontal-output type: plate on a top cap",
  }),
  T("6CD6GA", "beam-tetrode", H(6.3, 2.5), "octal", { ...big, note: "Horizontal-output type: plate on a top cap" }),
  T("6DQ6B", "beam-tetrode", H(6.3, 1.2), "octal", {
    aliases: ["6DQ6A"],
    note: "Horizontal-output type: plate on a top cap",
  }),
  T("12DQ6B", "beam-tetrode", H(12.6, 0.6), "octal", { aliases: ["12DQ6A"] }),
  T("6AV5GA", "beam-tetrode", H(6.3, 1.2), "octal", low),
  // 12.6 V octal (150 mA series strings).
  T("12A8GT", "pentagrid-converter", H(12.6, 0.15), "octal"),
  T("12J5GT", "triode", H(12.6, 0.15), "octal"),
  T("12J7GT", "pentode", H(12.6, 0.15), "octal"),
  T("12K7GT", "remote-cutoff-pentode", H(12.6, 0.15), "octal"),
  T("12K8", "triode-hexode", H(12.6, 0.15), "octal", low),
  T("12Q7GT", "duo-diode-triode", H(12.6, 0.15), "octal"),
  T("12SA7", "pentagrid-converter", H(12.6, 0.15), "octal", { aliases: ["12SA7GT"] }),
  T("12SC7", "dual-triode", H(12.6, 0.15), "octal"),
  T("12SG7", "remote-cutoff-pentode", H(12.6, 0.15), "octal"),
  T("12SH7", "pentode", H(12.6, 0.15), "octal"),
  T("12SJ7", "pentode", H(12.6, 0.15), "octal", { aliases: ["12SJ7GT"] }),
  T("12SK7", "remote-cutoff-pentode", H(12.6, 0.15), "octal", { aliases: ["12SK7GT"] }),
  T("12SQ7", "duo-diode-triode", H(12.6, 0.15), "octal", { aliases: ["12SQ7GT"] }),
  T("12SR7", "duo-diode-triode", H(12.6, 0.15), "octal"),
  // Loktal: 6.3 V types numbered 7, 12.6 V types numbered 14 [LS53, MEM].
  T("7A4", "triode", H(6.3, 0.3), "loktal"),
  T("7A7", "remote-cutoff-pentode", H(6.3, 0.3), "loktal"),
  T("7A8", "pentagrid-converter", H(6.3, 0.15), "loktal", low),
  T("7B4", "triode", H(6.3, 0.3), "loktal"),
  T("7B6", "duo-diode-triode", H(6.3, 0.3), "loktal"),
  T("7B7", "remote-cutoff-pentode", H(6.3, 0.15), "loktal", low),
  T("7C5", "beam-tetrode", H(6.3, 0.45), "loktal"),
  T("7C6", "duo-diode-triode", H(6.3, 0.15), "loktal", low),
  T("7F7", "dual-triode", H(6.3, 0.3), "loktal"),
  T("7H7", "pentode", H(6.3, 0.3), "loktal", low),
  T("7Q7", "pentagrid-converter", H(6.3, 0.3), "loktal", low),
  T("7Y4", "full-wave-rectifier", H(6.3, 0.5), "loktal", low),
  T("14A7", "remote-cutoff-pentode", H(12.6, 0.15), "loktal", low),
  T("14B6", "duo-diode-triode", H(12.6, 0.15), "loktal", low),
  T("14Q7", "pentagrid-converter", H(12.6, 0.15), "loktal", low),
];
