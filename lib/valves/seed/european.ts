// Seed rows: the European E (6.3 V parallel), P (300 mA series), U (100 mA
// series) radio and TV types on noval, rimlock, octal and magnoval bases.
// Heater and base from European data books [EU-DS], recalled from memory
// (MEM); "MEM?" where confidence is low. A heater left out means no figure
// we trust: the first letter still gives the series current [PE].

import type { ReferenceType } from "../reference-row";
import { EU, H } from "./builders";

const low = { source: "EU-DS MEM?" } as const;
const top = "Anode on a top cap: high voltage at the cap";

export const EUROPEAN_ROWS: readonly ReferenceType[] = [
  // E series, noval and 7-pin.
  EU("ECC808", "dual-triode", H(6.3, 0.34), "noval", { aliases: ["6KX8"], ...low }),
  EU("ECH83", "triode-heptode", H(6.3, 0.3), "noval", { aliases: ["6DS8"], ...low }),
  EU("ECL84", "triode-pentode", H(6.3, 0.72), "noval", { aliases: ["6DX8"], ...low }),
  EU("ECF86", "triode-pentode", undefined, "noval", { aliases: ["6HG8"], ...low }),
  EU("EF83", "pentode", H(6.3, 0.2), "noval", low),
  EU("EF92", "remote-cutoff-pentode", H(6.3, 0.2), "miniature-7-pin", low),
  EU("EBC81", "duo-diode-triode", H(6.3, 0.23), "noval", { aliases: ["6BD7"], ...low }),
  EU("EL81", "power-pentode", undefined, "noval", {
    aliases: ["6CJ6"],
    note: "Line-output type: anode on a top cap",
    ...low,
  }),
  EU("EL83", "power-pentode", H(6.3, 0.71), "noval", { aliases: ["6CK6"], ...low }),
  EU("EL91", "power-pentode", H(6.3, 0.2), "miniature-7-pin", { aliases: ["6AM5"], ...low }),
  EU("EM81", "tuning-indicator", H(6.3, 0.3), "noval", { aliases: ["6DA5"], ...low }),
  EU("EM87", "tuning-indicator", H(6.3, 0.3), "noval", { aliases: ["6HU6"], ...low }),
  EU("EC86", "triode", H(6.3, 0.175), "noval", { aliases: ["6CM4"], ...low }),
  EU("EY81", "damper-diode", undefined, "noval", low),
  EU("EY86", "half-wave-rectifier", H(6.3, 0.09), "noval", {
    note: "EHT rectifier of TV sets: very high voltage in use",
  }),
  // E series, rimlock (B8A).
  EU("EAF42", "duo-diode-pentode", H(6.3, 0.2), "rimlock", low),
  EU("EBC41", "duo-diode-triode", H(6.3, 0.23), "rimlock", low),
  EU("ECC40", "dual-triode", H(6.3, 0.6), "rimlock", low),
  EU("ECH42", "triode-hexode", H(6.3, 0.23), "rimlock", low),
  EU("EF40", "pentode", H(6.3, 0.2), "rimlock", low),
  EU("EF41", "remote-cutoff-pentode", H(6.3, 0.2), "rimlock", low),
  EU("EL41", "power-pentode", H(6.3, 0.71), "rimlock", low),
  EU("EL42", "power-pentode", H(6.3, 0.2), "rimlock", low),
  EU("EZ40", "full-wave-rectifier", H(6.3, 0.6), "rimlock", low),
  // E series, octal and magnoval.
  EU("ECC32", "dual-triode", H(6.3, 0.95), "octal", { note: "Not an equivalent of 6SN7GT despite the shared base" }),
  EU("ECC33", "dual-triode", H(6.3, 0.4), "octal", low),
  EU("ECC35", "dual-triode", H(6.3, 0.4), "octal", low),
  EU("EL36", "beam-tetrode", H(6.3, 1.25), "octal", { aliases: ["6CM5"], note: top }),
  EU("EM34", "tuning-indicator", H(6.3, 0.2), "octal", { aliases: ["6CD7"], ...low }),
  EU("EL500", "beam-tetrode", H(6.3, 1.38), "magnoval", { aliases: ["6GB5"], note: top, ...low }),
  // P series: 300 mA heater chains of TV sets.
  EU("PABC80", "diode-duo-diode-triode", H(9.5, 0.3), "noval", low),
  EU("PC86", "triode", H(3.8, 0.3), "noval", low),
  EU("PCC84", "dual-triode", H(7, 0.3), "noval", { aliases: ["7AN7"], ...low }),
  EU("PCC85", "dual-triode", undefined, "noval", low),
  EU("PCC189", "dual-triode", H(7.6, 0.3), "noval", { aliases: ["7ES8"], ...low }),
  EU("PCF80", "triode-pentode", H(9, 0.3), "noval", { aliases: ["9A8"] }),
  EU("PCF82", "triode-pentode", H(9, 0.3), "noval", low),
  EU("PCF86", "triode-pentode", undefined, "noval", low),
  EU("PCF802", "triode-pentode", H(9, 0.3), "noval", low),
  EU("PCL82", "triode-pentode", H(16, 0.3), "noval", { aliases: ["16A8"] }),
  EU("PCL84", "triode-pentode", H(15, 0.3), "noval", { aliases: ["15DQ8"], ...low }),
  EU("PCL85", "triode-pentode", H(18, 0.3), "noval", { aliases: ["18GV8"], ...low }),
  EU("PCL86", "triode-pentode", H(13.3, 0.3), "noval", { aliases: ["14GW8"], ...low }),
  EU("PL36", "beam-tetrode", H(25, 0.3), "octal", { note: top }),
  EU("PL81", "power-pentode", H(21.5, 0.3), "noval", { note: top, ...low }),
  EU("PL82", "power-pentode", H(16.5, 0.3), "noval", low),
  EU("PL83", "power-pentode", H(15, 0.3), "noval", low),
  EU("PL84", "power-pentode", H(15, 0.3), "noval", { note: "Not the same as EL84 apart from the heater" }),
  EU("PL500", "beam-tetrode", H(27, 0.3), "magnoval", { note: top }),
  EU("PL504", "beam-tetrode", H(27, 0.3), "magnoval", { note: top, ...low }),
  EU("PL509", "beam-tetrode", H(40, 0.3), "magnoval", { note: top, ...low }),
  EU("PY81", "damper-diode", H(17, 0.3), "noval", { note: top, ...low }),
  EU("PY82", "half-wave-rectifier", H(19, 0.3), "noval", low),
  EU("PY83", "damper-diode", undefined, "noval", low),
  EU("PY88", "damper-diode", H(30, 0.3), "noval", { note: top, ...low }),
  EU("PY500", "damper-diode", H(42, 0.3), "magnoval", { note: top, ...low }),
  // U series: 100 mA heater chains of AC/DC radios.
  EU("UABC80", "diode-duo-diode-triode", H(28, 0.1), "noval", low),
  EU("UBC81", "duo-diode-triode", H(14, 0.1), "noval", low),
  EU("UBF89", "duo-diode-pentode", H(19, 0.1), "noval", low),
  EU("UCC85", "dual-triode", H(26, 0.1), "noval", low),
  EU("UCH81", "triode-heptode", H(19, 0.1), "noval", low),
  EU("UCL82", "triode-pentode", H(50, 0.1), "noval", low),
  EU("UF89", "remote-cutoff-pentode", H(12.6, 0.1), "noval", low),
  EU("UL84", "power-pentode", H(45, 0.1), "noval", { note: "Not the same as EL84 apart from the heater" }),
  EU("UY85", "half-wave-rectifier", H(38, 0.1), "noval", low),
  EU("UAF42", "duo-diode-pentode", H(12.6, 0.1), "rimlock", low),
  EU("UBC41", "duo-diode-triode", H(14, 0.1), "rimlock", low),
  EU("UCH42", "triode-hexode", H(14, 0.1), "rimlock", low),
  EU("UF41", "remote-cutoff-pentode", H(12.6, 0.1), "rimlock", low),
  EU("UL41", "power-pentode", H(45, 0.1), "rimlock", low),
  EU("UY41", "half-wave-rectifier", H(31, 0.1), "rimlock", low),
  // D series battery rectifier for EHT.
  EU("DY86", "half-wave-rectifier", H(1.4, 0.55, true), "noval", {
    note: "EHT rectifier of TV sets: very high voltage in use",
    ...low,
  }),
];
