// Seed rows: special-quality, industrial and military numbers that turn up
// in boxes beside the ordinary types. Four-digit EIA registrations carry no
// heater meaning [MEM]; heater and base from the type sheets [MIL-E-1, REG],
// recalled from memory. The family links to the ordinary types live in the
// equivalents table (which also holds the CV register numbers); a row here
// names only what it is.

import type { ReferenceType } from "../reference-row";
import { H, T, TAP } from "./builders";

const sq = (extra: { aliases?: string[]; note?: string } = {}) => ({ source: "MIL-E-1/REG MEM?", ...extra });

export const SPECIAL_QUALITY_ROWS: readonly ReferenceType[] = [
  T("5654", "pentode", H(6.3, 0.175), "miniature-7-pin", sq({ aliases: ["6AK5W"], note: "Special-quality 6AK5" })),
  T("5670", "dual-triode", H(6.3, 0.35), "noval", sq()),
  T("5687", "dual-triode", TAP(0.45), "noval", sq()),
  T("5691", "dual-triode", H(6.3, 0.6), "octal", sq({ note: "Special-quality 6SL7-type" })),
  T("5692", "dual-triode", H(6.3, 0.6), "octal", sq({ note: "Special-quality 6SN7-type" })),
  T("5693", "pentode", H(6.3, 0.3), "octal", sq({ note: "Special-quality 6SJ7-type" })),
  T("5749", "remote-cutoff-pentode", H(6.3, 0.3), "miniature-7-pin", sq({ aliases: ["6BA6W"] })),
  T("5750", "pentagrid-converter", H(6.3, 0.3), "miniature-7-pin", sq({ aliases: ["6BE6W"] })),
  T("5763", "power-pentode", H(6.3, 0.75), "noval", sq()),
  T("5879", "pentode", H(6.3, 0.15), "noval", sq()),
  T("5963", "dual-triode", TAP(0.15), "noval", sq({ note: "Computer-service 12AU7 variant: substitute with caveats" })),
  T("6005", "beam-tetrode", H(6.3, 0.45), "miniature-7-pin", sq({ aliases: ["6AQ5W"] })),
  T("6072", "dual-triode", TAP(0.175), "noval", sq({ aliases: ["6072A"], note: "Special-quality 12AY7-type" })),
  T("6100", "triode", H(6.3, 0.15), "miniature-7-pin", sq({ aliases: ["6C4W"] })),
  T("6136", "pentode", H(6.3, 0.3), "miniature-7-pin", sq({ aliases: ["6AU6WA"] })),
  T("6189", "dual-triode", TAP(0.15), "noval", sq({ aliases: ["12AU7WA"], note: "Ruggedised 12AU7" })),
  T("6201", "dual-triode", TAP(0.15), "noval", sq({ aliases: ["12AT7WA"], note: "Ruggedised 12AT7" })),
  T("6660", "remote-cutoff-pentode", H(6.3, 0.3), "miniature-7-pin", sq({ note: "Special-quality 6BA6" })),
  T("6661", "pentode", H(6.3, 0.15), "miniature-7-pin", sq({ note: "Special-quality 6BH6" })),
  T("6662", "remote-cutoff-pentode", H(6.3, 0.15), "miniature-7-pin", sq({ note: "Special-quality 6BJ6" })),
  T("6663", "twin-diode", H(6.3, 0.3), "miniature-7-pin", sq({ note: "Special-quality 6AL5" })),
  T("6664", "triode", H(6.3, 0.15), "miniature-7-pin", sq({ note: "Special-quality 6AB4" })),
  T("6669", "beam-tetrode", H(6.3, 0.45), "miniature-7-pin", sq({ note: "Special-quality 6AQ5A" })),
  T("6679", "dual-triode", TAP(0.15), "noval", sq({ note: "Special-quality 12AT7" })),
  T("6681", "dual-triode", TAP(0.15), "noval", sq({ note: "Special-quality 12AX7" })),
  T("E80F", "pentode", H(6.3, 0.3), "noval", { source: "EU-DS MEM?" }),
  T("E180F", "pentode", H(6.3, 0.3), "noval", { source: "EU-DS MEM?" }),
  T("E81CC", "dual-triode", TAP(0.15), "noval", { source: "EU-DS MEM?", note: "Special-quality 12AT7 (ECC81)" }),
  T("E82CC", "dual-triode", TAP(0.15), "noval", { source: "EU-DS MEM?", note: "Special-quality 12AU7 (ECC82)" }),
  T("E83CC", "dual-triode", TAP(0.15), "noval", { source: "EU-DS MEM?", note: "Special-quality 12AX7 (ECC83)" }),
];
