// Seed rows: US 7-pin and noval receiving types of radio, TV and audio sets.
// Heater and base from registered figures [REG], recalled from memory (MEM);
// "MEM?" where confidence is low. Characteristics are left empty: never a
// figure invented to fill a column. European names are aliases only where
// makers' cross-references print them as the same type [MEM].

import type { ReferenceType } from "../reference-row";
import { H, T, TAP } from "./builders";

const low = { source: "REG MEM?" } as const;

export const US_MINIATURE_ROWS: readonly ReferenceType[] = [
  // 7-pin small-signal.
  T("6AB4", "triode", H(6.3, 0.15), "miniature-7-pin", { aliases: ["EC92"] }),
  T("6AF4A", "triode", H(6.3, 0.225), "miniature-7-pin", low),
  T("6AG5", "pentode", H(6.3, 0.3), "miniature-7-pin"),
  T("6AH6", "pentode", H(6.3, 0.45), "miniature-7-pin"),
  T("6AM6", "pentode", H(6.3, 0.3), "miniature-7-pin", { aliases: ["EF91"] }),
  T("6AT6", "duo-diode-triode", H(6.3, 0.3), "miniature-7-pin", { aliases: ["EBC90"] }),
  T("6BC5", "pentode", H(6.3, 0.3), "miniature-7-pin"),
  T("6BD6", "remote-cutoff-pentode", H(6.3, 0.3), "miniature-7-pin"),
  T("6BH6", "pentode", H(6.3, 0.15), "miniature-7-pin"),
  T("6BJ6", "remote-cutoff-pentode", H(6.3, 0.15), "miniature-7-pin"),
  T("6BN6", "pentode", H(6.3, 0.3), "miniature-7-pin", { note: "Gated-beam limiter-discriminator" }),
  T("6BY6", "pentagrid-converter", H(6.3, 0.3), "miniature-7-pin", low),
  T("6BZ6", "remote-cutoff-pentode", H(6.3, 0.3), "miniature-7-pin"),
  T("6CB6", "pentode", H(6.3, 0.3), "miniature-7-pin", { aliases: ["6CB6A"] }),
  T("6CS6", "pentagrid-converter", H(6.3, 0.3), "miniature-7-pin"),
  T("6DT6", "pentode", H(6.3, 0.3), "miniature-7-pin", { aliases: ["6DT6A"] }),
  T("6J6", "dual-triode", H(6.3, 0.45), "miniature-7-pin", { aliases: ["ECC91"] }),
  // 7-pin output and rectifier.
  T("6AK6", "power-pentode", H(6.3, 0.15), "miniature-7-pin"),
  T("6AR5", "power-pentode", H(6.3, 0.4), "miniature-7-pin", low),
  T("6AS5", "beam-tetrode", H(6.3, 0.8), "miniature-7-pin", low),
  T("6BW4", "full-wave-rectifier", H(6.3, 0.9), "noval", low),
  T("12X4", "full-wave-rectifier", H(12.6, 0.3), "miniature-7-pin"),
  // Noval small-signal and TV.
  T("6AN8", "triode-pentode", H(6.3, 0.45), "noval", { aliases: ["6AN8A"] }),
  T("6AQ8", "dual-triode", H(6.3, 0.435), "noval", { aliases: ["ECC85"], source: "EU-DS MEM" }),
  T("6AJ8", "triode-heptode", H(6.3, 0.3), "noval", { aliases: ["ECH81"], source: "EU-DS MEM" }),
  T("6AB8", "triode-pentode", H(6.3, 0.3), "noval", { aliases: ["ECL80"], source: "EU-DS MEM" }),
  T("6BA7", "pentagrid-converter", H(6.3, 0.3), "noval", low),
  T("6BC8", "dual-triode", H(6.3, 0.4), "noval"),
  T("6BK7B", "dual-triode", H(6.3, 0.45), "noval", low),
  T("6BL8", "triode-pentode", H(6.3, 0.43), "noval", { aliases: ["ECF80"], source: "EU-DS MEM" }),
  T("6BQ7A", "dual-triode", H(6.3, 0.4), "noval"),
  T("6BS8", "dual-triode", H(6.3, 0.4), "noval"),
  T("6BX6", "pentode", H(6.3, 0.3), "noval", { aliases: ["EF80"], source: "EU-DS MEM" }),
  T("6BY7", "pentode", H(6.3, 0.3), "noval", { aliases: ["EF85"], source: "EU-DS MEM" }),
  T("6BZ7", "dual-triode", H(6.3, 0.4), "noval"),
  T("6CG8A", "triode-pentode", H(6.3, 0.45), "noval", low),
  T("6CL6", "power-pentode", H(6.3, 0.65), "noval"),
  T("6CW7", "dual-triode", H(6.3, 0.335), "noval", { aliases: ["ECC84"], source: "EU-DS MEM" }),
  T("6CX8", "triode-pentode", H(6.3, 0.75), "noval", low),
  T("6CZ5", "beam-tetrode", H(6.3, 0.45), "noval", low),
  T("6DA6", "remote-cutoff-pentode", H(6.3, 0.2), "noval", { aliases: ["EF89"], source: "EU-DS MEM" }),
  T("6DC8", "duo-diode-pentode", H(6.3, 0.3), "noval", { aliases: ["EBF89"], source: "EU-DS MEM" }),
  T("6EA8", "triode-pentode", H(6.3, 0.45), "noval"),
  T("6EH7", "remote-cutoff-pentode", H(6.3, 0.3), "noval", { aliases: ["EF183"], source: "EU-DS MEM" }),
  T("6EJ7", "pentode", H(6.3, 0.3), "noval", { aliases: ["EF184"], source: "EU-DS MEM" }),
  T("6ES8", "dual-triode", H(6.3, 0.365), "noval", { aliases: ["ECC189"], source: "EU-DS MEM" }),
  T("6EU7", "dual-triode", H(6.3, 0.3), "noval"),
  T("6GH8A", "triode-pentode", H(6.3, 0.45), "noval", low),
  T("6GV8", "triode-pentode", H(6.3, 0.9), "noval", { aliases: ["ECL85"], source: "EU-DS MEM" }),
  T("6GW8", "triode-pentode", H(6.3, 0.7), "noval", { aliases: ["ECL86"], source: "EU-DS MEM?" }),
  T("6N8", "duo-diode-pentode", H(6.3, 0.3), "noval", { aliases: ["EBF80"], source: "EU-DS MEM" }),
  T("6T8A", "diode-duo-diode-triode", H(6.3, 0.45), "noval", { aliases: ["6T8"] }),
  T("6U8A", "triode-pentode", H(6.3, 0.45), "noval", { aliases: ["6U8", "ECF82"] }),
  T("6CW5", "power-pentode", H(6.3, 0.76), "noval", { aliases: ["EL86"], source: "EU-DS MEM" }),
  T("6DL5", "power-pentode", H(6.3, 0.2), "noval", { aliases: ["EL95"], source: "EU-DS MEM" }),
  T("6BR5", "tuning-indicator", H(6.3, 0.3), "noval", { aliases: ["EM80"], source: "EU-DS MEM" }),
  T("6V4", "full-wave-rectifier", H(6.3, 0.6), "noval", { aliases: ["EZ80"], source: "EU-DS MEM" }),
  T("6973", "beam-tetrode", H(6.3, 0.45), "noval", low),
  T("7189A", "power-pentode", H(6.3, 0.76), "noval", {
    aliases: ["7189"],
    note: "Upward-rated EL84: replaces 6BQ5, not necessarily the reverse",
  }),
  // 12.6 V miniature (150 mA series strings and car sets) and tapped types.
  T("12AD6", "pentagrid-converter", H(12.6, 0.15), "miniature-7-pin", low),
  T("12AF6", "remote-cutoff-pentode", H(12.6, 0.15), "miniature-7-pin", low),
  T("12AL5", "twin-diode", H(12.6, 0.15), "miniature-7-pin"),
  T("12AQ5", "beam-tetrode", H(12.6, 0.225), "miniature-7-pin", low),
  T("12AT6", "duo-diode-triode", H(12.6, 0.15), "miniature-7-pin"),
  T("12AU6", "pentode", H(12.6, 0.15), "miniature-7-pin"),
  T("12AW6", "pentode", H(12.6, 0.15), "miniature-7-pin"),
  T("12BD6", "remote-cutoff-pentode", H(12.6, 0.15), "miniature-7-pin"),
  T("12AV7", "dual-triode", TAP(0.225), "noval", low),
  T("12AZ7A", "dual-triode", TAP(0.225), "noval", { aliases: ["12AZ7"], ...low }),
  T("12B4A", "triode", TAP(0.3), "noval"),
  T("12BY7A", "pentode", TAP(0.3), "noval", { aliases: ["12BY7"] }),
  T("12BZ7", "dual-triode", TAP(0.3), "noval"),
  T("12DW7", "dual-triode", TAP(0.15), "noval", { aliases: ["7247"], note: "One 12AX7 section and one 12AU7 section" }),
  T("19T8", "diode-duo-diode-triode", H(18.9, 0.15), "noval", low),
];
