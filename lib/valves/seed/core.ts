// Seed rows: the reference table's first 68 rows (see builders.ts for the
// helpers). Values unchanged from the first release, with two fixes: 5Y3GT is
// directly heated (filament) [REG MEM]; the 5AR4 note says higher output
// voltage (lower drop), not higher DC output [MEM].

import type { ReferenceType } from "../reference-row";
import { H, MEM_YEAR, MERCURY, PEN, PRIMING_SOURCE, RECT, REGV, TAP, TRI, row } from "./builders";

/**
 * The first reference rows: common receiving, audio, rectifier and regulator
 * types. Two rows (12AX7, 6SN7GT) were checked against published data-sheet
 * transcriptions; the others are registered or data-book figures from memory.
 */
export const CORE_ROWS: readonly ReferenceType[] = [
  // Small-signal triodes. Dual-triode figures are per section.
  row({ designation: "12AX7", aliases: ["ECC83", "12AX7A", "7025"], kind: "dual-triode", heater: TAP(0.15), base: "noval", introduced: MEM_YEAR(1947), characteristics: TRI(250, -2, 100, 1600, 1.2, 62500), source: "REG ✓" }),
  row({ designation: "12AU7", aliases: ["ECC82", "12AU7A"], kind: "dual-triode", heater: TAP(0.15), base: "noval", characteristics: TRI(250, -8.5, 17, 2200, 10.5, 7700), source: "REG MEM" }),
  row({ designation: "12AT7", aliases: ["ECC81"], kind: "dual-triode", heater: TAP(0.15), base: "noval", characteristics: TRI(250, -2, 60, 5500, 10, 10900), source: "REG MEM" }),
  row({ designation: "12AY7", kind: "dual-triode", heater: TAP(0.15), base: "noval", characteristics: TRI(250, -4, 44, 1750, 3.0, 25000), source: "REG MEM?", note: "µ quoted as 40-44 in secondary sources" }),
  row({ designation: "5751", kind: "dual-triode", heater: TAP(0.175), base: "noval", characteristics: TRI(250, -3, 70, 1200, 1.0, 58000), source: "MIL-E-1/REG MEM" }),
  row({ designation: "5814A", kind: "dual-triode", heater: TAP(0.175), base: "noval", characteristics: TRI(250, -8.5, 17, 2200, 10.5), source: "MIL-E-1/REG MEM?", note: "Heater about 0.175/0.35 A; verify on the data sheet" }),
  row({ designation: "12BH7A", aliases: ["12BH7"], kind: "dual-triode", heater: TAP(0.3), base: "noval", characteristics: TRI(250, -10.5, 16.5, 3100, 11.5, 5300), source: "REG MEM" }),
  row({ designation: "6DJ8", aliases: ["ECC88"], kind: "dual-triode", heater: H(6.3, 0.365), base: "noval", characteristics: TRI(90, -1.3, 33, 12500, 15, 2600), source: "EU-DS MEM", note: "Heater current checked (0.365 A)" }),
  row({ designation: "6922", aliases: ["E88CC"], kind: "dual-triode", heater: H(6.3, 0.3), base: "noval", characteristics: TRI(90, -1.3, 33, 12500, 15), source: "EU-DS MEM", note: "Heater current checked (0.3 A)" }),
  row({ designation: "7308", aliases: ["E188CC"], kind: "dual-triode", heater: H(6.3, 0.335), base: "noval", source: "EU-DS MEM", note: "Heater current checked (0.335 A); characteristics close to 6922, not tabulated here" }),
  row({ designation: "PCC88", aliases: ["7DJ8"], kind: "dual-triode", heater: H(7, 0.3), base: "noval", source: "EU-DS MEM", note: "Heater checked (7 V 0.3 A, 300 mA series string); not a drop-in for 6DJ8" }),
  row({ designation: "6SN7GT", aliases: ["6SN7GTA", "6SN7GTB", "VT231"], kind: "dual-triode", heater: H(6.3, 0.6), base: "octal", introduced: MEM_YEAR(1939), characteristics: TRI(250, -8, 20, 2600, 9, 7700), source: "REG ✓" }),
  row({ designation: "12SN7GT", kind: "dual-triode", heater: H(12.6, 0.3), base: "octal", characteristics: TRI(250, -8, 20, 2600, 9, 7700), source: "REG MEM" }),
  row({ designation: "6SL7GT", kind: "dual-triode", heater: H(6.3, 0.3), base: "octal", characteristics: TRI(250, -2, 70, 1600, 2.3, 44000), source: "REG MEM" }),
  row({ designation: "12SL7GT", kind: "dual-triode", heater: H(12.6, 0.15), base: "octal", characteristics: TRI(250, -2, 70, 1600, 2.3, 44000), source: "REG MEM" }),
  row({ designation: "6CG7", aliases: ["6FQ7"], kind: "dual-triode", heater: H(6.3, 0.6), base: "noval", characteristics: TRI(250, -8, 20, 2600, 9, 7700), source: "REG MEM" }),
  row({ designation: "7N7", kind: "dual-triode", heater: H(6.3, 0.6), base: "loktal", characteristics: TRI(250, -8, 20, 2600, 9, 7700), source: "REG MEM" }),
  row({ designation: "6J5", aliases: ["6J5GT"], kind: "triode", heater: H(6.3, 0.3), base: "octal", characteristics: TRI(250, -8, 20, 2600, 9, 7700), source: "REG MEM" }),
  row({ designation: "6C4", aliases: ["EC90"], kind: "triode", heater: H(6.3, 0.15), base: "miniature-7-pin", characteristics: TRI(250, -8.5, 17, 2200, 10.5, 7700), source: "REG MEM" }),
  row({ designation: "6SQ7", kind: "duo-diode-triode", heater: H(6.3, 0.3), base: "octal", characteristics: TRI(250, -2, 100, 1100, 0.9, 91000), source: "REG MEM" }),
  row({ designation: "12AV6", kind: "duo-diode-triode", heater: H(12.6, 0.15), base: "miniature-7-pin", characteristics: TRI(250, -2, 100, 1600, 1.2, 62500), source: "REG MEM" }),
  row({ designation: "6AV6", aliases: ["EBC91"], kind: "duo-diode-triode", heater: H(6.3, 0.3), base: "miniature-7-pin", characteristics: TRI(250, -2, 100, 1600, 1.2, 62500), source: "REG MEM" }),
  // Power triodes.
  row({ designation: "2A3", kind: "power-triode", heater: H(2.5, 2.5, true), base: "four-pin", characteristics: TRI(250, -45, 4.2, 5250, 60, 800), largeEnvelope: true, source: "REG MEM" }),
  row({ designation: "300B", kind: "power-triode", heater: H(5, 1.2, true), base: "four-pin", characteristics: TRI(300, -61, 3.85, 5500, 60, 700), largeEnvelope: true, source: "REG MEM?" }),
  row({ designation: "6AS7G", kind: "dual-power-triode", heater: H(6.3, 2.5), base: "octal", characteristics: TRI(135, { rk: 250 }, 2, 7000, 125, 280), largeEnvelope: true, source: "REG MEM" }),
  // Small-signal pentodes and converters.
  row({ designation: "EF86", aliases: ["6267"], kind: "pentode", heater: H(6.3, 0.2), base: "noval", characteristics: PEN(250, 140, -2, 2000, 3.0, true), source: "EU-DS MEM?" }),
  row({ designation: "6AU6", aliases: ["EF94", "6AU6A"], kind: "pentode", heater: H(6.3, 0.3), base: "miniature-7-pin", characteristics: PEN(250, 150, { rk: 68 }, 5200, 10.6), source: "REG MEM" }),
  row({ designation: "6BA6", aliases: ["EF93"], kind: "remote-cutoff-pentode", heater: H(6.3, 0.3), base: "miniature-7-pin", characteristics: PEN(250, 100, { rk: 68 }, 4400, 11), source: "REG MEM" }),
  row({ designation: "12BA6", kind: "remote-cutoff-pentode", heater: H(12.6, 0.15), base: "miniature-7-pin", characteristics: PEN(250, 100, { rk: 68 }, 4400, 11), source: "REG MEM" }),
  row({ designation: "6SJ7", kind: "pentode", heater: H(6.3, 0.3), base: "octal", characteristics: PEN(250, 100, -3, 1650, 3.0), source: "REG MEM" }),
  row({ designation: "6SK7", kind: "remote-cutoff-pentode", heater: H(6.3, 0.3), base: "octal", characteristics: PEN(250, 100, -3, 2000, 9.2), source: "REG MEM" }),
  row({ designation: "6AK5", aliases: ["EF95"], kind: "pentode", heater: H(6.3, 0.175), base: "miniature-7-pin", characteristics: PEN(180, 120, { rk: 200 }, 5100, 7.7), source: "REG MEM" }),
  row({ designation: "1T4", aliases: ["DF91"], kind: "remote-cutoff-pentode", heater: H(1.4, 0.05, true), base: "miniature-7-pin", characteristics: PEN(90, 67.5, 0, 900, 3.5, true), source: "REG MEM?" }),
  row({ designation: "6BE6", aliases: ["EK90"], kind: "pentagrid-converter", heater: H(6.3, 0.3), base: "miniature-7-pin", source: "REG MEM", note: "Converter: conversion characteristics not tabulated" }),
  row({ designation: "12BE6", kind: "pentagrid-converter", heater: H(12.6, 0.15), base: "miniature-7-pin", source: "REG MEM", note: "Converter: conversion characteristics not tabulated" }),
  // Output types. Figures are single-tube class A1 at plate/screen volts shown.
  row({ designation: "6V6GT", aliases: ["6V6GTA"], kind: "beam-tetrode", heater: H(6.3, 0.45), base: "octal", characteristics: PEN(250, 250, -12.5, 4100, 45), source: "REG MEM" }),
  row({ designation: "6V6", aliases: ["6V6G"], kind: "beam-tetrode", heater: H(6.3, 0.45), base: "octal", characteristics: PEN(250, 250, -12.5, 4100, 45), source: "REG MEM", note: "Plain 6V6 is the original all-metal version" }),
  row({ designation: "6AQ5", aliases: ["EL90", "6AQ5A"], kind: "beam-tetrode", heater: H(6.3, 0.45), base: "miniature-7-pin", characteristics: PEN(250, 250, -12.5, 4100, 45), source: "REG MEM" }),
  row({ designation: "6L6GC", kind: "beam-tetrode", heater: H(6.3, 0.9), base: "octal", characteristics: PEN(250, 250, -14, 6000, 72), source: "REG MEM", note: "Heater current checked (0.9 A); 30 W plate rating checked" }),
  row({ designation: "6L6", aliases: ["6L6G"], kind: "beam-tetrode", heater: H(6.3, 0.9), base: "octal", introduced: MEM_YEAR(1936), characteristics: PEN(250, 250, -14, 6000, 72), source: "REG MEM", note: "Plain 6L6 is the original all-metal version; lower ratings than 6L6GC" }),
  row({ designation: "5881", kind: "beam-tetrode", heater: H(6.3, 0.9), base: "octal", characteristics: PEN(250, 250, -14, 6000, 72), source: "REG MEM?" }),
  row({ designation: "EL34", aliases: ["6CA7"], kind: "power-pentode", heater: H(6.3, 1.5), base: "octal", characteristics: PEN(250, 250, -12.2, 11000, 100), largeEnvelope: true, source: "EU-DS MEM", note: "Some tubes sold as 6CA7 were beam tetrodes with different bulbs and curves" }),
  row({ designation: "EL84", aliases: ["6BQ5"], kind: "power-pentode", heater: H(6.3, 0.76), base: "noval", introduced: MEM_YEAR(1953), characteristics: PEN(250, 250, -7.3, 11300, 48), source: "EU-DS MEM", note: "Heater current checked (0.76 A)" }),
  row({ designation: "6550", kind: "beam-tetrode", heater: H(6.3, 1.6), base: "octal", characteristics: PEN(250, 250, -14, 11000, 140, true), largeEnvelope: true, source: "REG MEM?" }),
  row({ designation: "KT88", kind: "beam-tetrode", heater: H(6.3, 1.6), base: "octal", characteristics: PEN(250, 250, -15, 11500, 140, true), largeEnvelope: true, source: "EU-DS MEM?", note: "Heater current checked (1.6 A); bias and Gm approximate" }),
  row({ designation: "KT66", kind: "beam-tetrode", heater: H(6.3, 1.3), base: "octal", largeEnvelope: true, source: "EU-DS MEM?", note: "Heater about 1.3 A; characteristics not tabulated here" }),
  row({ designation: "6F6", aliases: ["6F6G"], kind: "power-pentode", heater: H(6.3, 0.7), base: "octal", characteristics: PEN(250, 250, -16.5, 2500, 34), source: "REG MEM" }),
  row({ designation: "6K6GT", kind: "power-pentode", heater: H(6.3, 0.4), base: "octal", characteristics: PEN(250, 250, -18, 2300, 32), source: "REG MEM?" }),
  row({ designation: "50C5", kind: "beam-tetrode", heater: H(50, 0.15), base: "miniature-7-pin", characteristics: PEN(110, 110, -7.5, 7500, 49), source: "REG MEM" }),
  row({ designation: "6BM8", aliases: ["ECL82"], kind: "triode-pentode", heater: H(6.3, 0.78), base: "noval", source: "EU-DS MEM?" }),
  row({ designation: "EABC80", aliases: ["6AK8"], kind: "diode-duo-diode-triode", heater: H(6.3, 0.45), base: "noval", source: "EU-DS MEM?" }),
  row({ designation: "EM84", aliases: ["6FG6"], kind: "tuning-indicator", heater: H(6.3, 0.21), base: "noval", source: "EU-DS MEM?" }),
  // Diodes and rectifiers. Output currents are approximate capacitor-input figures.
  row({ designation: "6AL5", aliases: ["EAA91"], kind: "twin-diode", heater: H(6.3, 0.3), base: "miniature-7-pin", source: "REG MEM" }),
  row({ designation: "6X4", aliases: ["EZ90"], kind: "full-wave-rectifier", heater: H(6.3, 0.6), base: "miniature-7-pin", characteristics: RECT(70), source: "REG MEM" }),
  row({ designation: "6X5GT", kind: "full-wave-rectifier", heater: H(6.3, 0.6), base: "octal", characteristics: RECT(70), source: "REG MEM" }),
  row({ designation: "5Y3GT", kind: "full-wave-rectifier", heater: H(5, 2, true), base: "octal", characteristics: RECT(125), source: "REG MEM" }),
  row({ designation: "5U4GB", kind: "full-wave-rectifier", heater: H(5, 3, true), base: "octal", characteristics: RECT(275), largeEnvelope: true, source: "REG MEM?" }),
  row({ designation: "5AR4", aliases: ["GZ34"], kind: "full-wave-rectifier", heater: H(5, 1.9), base: "octal", characteristics: RECT(250), source: "MEM?", note: "Indirectly heated, low drop: in place of 5U4GB or 5Y3GT it gives a higher output voltage (lower drop), and draws a different heater current" }),
  row({ designation: "EZ81", aliases: ["6CA4"], kind: "full-wave-rectifier", heater: H(6.3, 1), base: "noval", characteristics: RECT(150), source: "EU-DS MEM" }),
  row({ designation: "35W4", kind: "half-wave-rectifier", heater: H(35, 0.15), base: "miniature-7-pin", characteristics: RECT(100), source: "REG MEM?" }),
  row({ designation: "83", kind: "full-wave-rectifier", heater: H(5, 3, true), base: "four-pin", characteristics: RECT(), hazards: [MERCURY], largeEnvelope: true, source: "REG MEM", note: "Mercury-vapour rectifier" }),
  row({ designation: "866A", kind: "half-wave-rectifier", heater: H(2.5, 5, true), base: "four-pin", characteristics: RECT(), hazards: [MERCURY], largeEnvelope: true, source: "REG MEM", note: "Mercury-vapour rectifier, plate on a top cap" }),
  // Cold-cathode gas regulators: no heater.
  row({ designation: "0A2", kind: "voltage-regulator", heater: null, base: "miniature-7-pin", characteristics: REGV(150, 5, 30), hazards: [PRIMING_SOURCE], source: "MEM" }),
  row({ designation: "0B2", kind: "voltage-regulator", heater: null, base: "miniature-7-pin", characteristics: REGV(108, 5, 30), hazards: [PRIMING_SOURCE], source: "MEM" }),
  row({ designation: "0C3", aliases: ["VR105"], kind: "voltage-regulator", heater: null, base: "octal", characteristics: REGV(105, 5, 40), hazards: [PRIMING_SOURCE], source: "MEM" }),
  row({ designation: "0D3", aliases: ["VR150"], kind: "voltage-regulator", heater: null, base: "octal", characteristics: REGV(150, 5, 40), hazards: [PRIMING_SOURCE], source: "MEM" }),
];

