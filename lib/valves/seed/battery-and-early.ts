// Seed rows: battery types (1.4 V and the earlier 2.0 V filaments) and
// pre-octal receiving and audio types. Heater and base from registered
// figures [REG], recalled from memory (MEM); "MEM?" where confidence is low.
// European battery names are aliases where cross-references print them.

import type { ReferenceType } from "../reference-row";
import { B28, H, T } from "./builders";

const low = { source: "REG MEM?" } as const;
const F = (volts: number, amps: number) => H(volts, amps, true);

export const BATTERY_AND_EARLY_ROWS: readonly ReferenceType[] = [
  // 1.4 V battery miniatures.
  T("1L4", "pentode", F(1.4, 0.05), "miniature-7-pin", { aliases: ["DF92"] }),
  T("1L6", "pentagrid-converter", F(1.4, 0.05), "miniature-7-pin", low),
  T("1R5", "pentagrid-converter", F(1.4, 0.05), "miniature-7-pin", { aliases: ["DK91"] }),
  T("1S5", "duo-diode-pentode", F(1.4, 0.05), "miniature-7-pin", { aliases: ["DAF91"] }),
  T("1U4", "remote-cutoff-pentode", F(1.4, 0.05), "miniature-7-pin"),
  T("1U5", "duo-diode-pentode", F(1.4, 0.05), "miniature-7-pin"),
  T("3Q4", "power-pentode", B28(0.05), "miniature-7-pin", { aliases: ["DL95"], ...low }),
  T("3S4", "power-pentode", B28(0.05), "miniature-7-pin", { aliases: ["DL92"] }),
  T("3V4", "power-pentode", B28(0.05), "miniature-7-pin", { aliases: ["DL94"], ...low }),
  T("DK96", "pentagrid-converter", F(1.4, 0.025), "miniature-7-pin", { source: "EU-DS MEM?" }),
  T("DF96", "pentode", F(1.4, 0.025), "miniature-7-pin", { source: "EU-DS MEM?" }),
  T("DAF96", "duo-diode-pentode", F(1.4, 0.025), "miniature-7-pin", { source: "EU-DS MEM?" }),
  T("DL96", "power-pentode", B28(0.025), "miniature-7-pin", { source: "EU-DS MEM?" }),
  // 1.4 V battery octal and loktal.
  T("1A7GT", "pentagrid-converter", F(1.4, 0.05), "octal"),
  T("1H5GT", "duo-diode-triode", F(1.4, 0.05), "octal"),
  T("1N5GT", "pentode", F(1.4, 0.05), "octal"),
  T("3Q5GT", "beam-tetrode", B28(0.05), "octal", low),
  T("1LN5", "pentode", F(1.4, 0.05), "loktal", low),
  // 2.0 V battery types: numbered 1 although above 1.6 V [MEM].
  T("1A6", "pentagrid-converter", F(2, 0.06), "pre-octal", low),
  T("1C6", "pentagrid-converter", F(2, 0.12), "pre-octal", low),
  T("1F4", "power-pentode", F(2, 0.12), "pre-octal", low),
  T("30", "triode", F(2, 0.06), "four-pin", low),
  // Pre-octal AC types.
  T("24A", "pentode", H(2.5, 1.75), "pre-octal", low),
  T("27", "triode", H(2.5, 1.75), "pre-octal"),
  T("35", "remote-cutoff-pentode", H(2.5, 1.75), "pre-octal", low),
  T("45", "power-triode", F(2.5, 1.5), "four-pin", { largeEnvelope: true }),
  T("47", "power-pentode", F(2.5, 1.75), "pre-octal", low),
  T("56", "triode", H(2.5, 1), "pre-octal"),
  T("57", "pentode", H(2.5, 1), "pre-octal"),
  T("58", "remote-cutoff-pentode", H(2.5, 1), "pre-octal"),
  T("2A5", "power-pentode", H(2.5, 1.75), "pre-octal"),
  T("2A6", "duo-diode-triode", H(2.5, 0.8), "pre-octal"),
  T("2A7", "pentagrid-converter", H(2.5, 0.8), "pre-octal"),
  T("6A6", "dual-power-triode", H(6.3, 0.8), "pre-octal", low),
  T("6A7", "pentagrid-converter", H(6.3, 0.3), "pre-octal"),
  T("6B7", "duo-diode-pentode", H(6.3, 0.3), "pre-octal", low),
  T("6C6", "pentode", H(6.3, 0.3), "pre-octal"),
  T("6D6", "remote-cutoff-pentode", H(6.3, 0.3), "pre-octal"),
  T("6E5", "tuning-indicator", H(6.3, 0.3), "pre-octal"),
  T("6U5", "tuning-indicator", H(6.3, 0.3), "pre-octal", low),
  T("41", "power-pentode", H(6.3, 0.4), "pre-octal"),
  T("42", "power-pentode", H(6.3, 0.7), "pre-octal"),
  T("75", "duo-diode-triode", H(6.3, 0.3), "pre-octal"),
  T("76", "triode", H(6.3, 0.3), "pre-octal"),
  T("77", "pentode", H(6.3, 0.3), "pre-octal"),
  T("78", "remote-cutoff-pentode", H(6.3, 0.3), "pre-octal"),
  T("80", "full-wave-rectifier", F(5, 2), "four-pin", { largeEnvelope: true }),
  T("5Z3", "full-wave-rectifier", F(5, 3), "four-pin", { largeEnvelope: true }),
  // Transmitting and audio power, high voltage on top caps.
  T("807", "beam-tetrode", H(6.3, 0.9), "pre-octal", { note: "Plate on a top cap: high voltage at the cap" }),
  T("811A", "power-triode", F(6.3, 4), "four-pin", { largeEnvelope: true, ...low }),
  T("572B", "power-triode", F(6.3, 4), "four-pin", { largeEnvelope: true, ...low }),
  T("211", "power-triode", F(10, 3.25), "four-pin", { aliases: ["VT4C"], largeEnvelope: true, ...low }),
  T("845", "power-triode", F(10, 3.25), "four-pin", { largeEnvelope: true, ...low }),
];
