// Seed rows: rectifiers (vacuum, mercury-vapour, gas), TV EHT rectifiers and
// cold-cathode regulators. Heater and base from registered figures [REG],
// recalled from memory (MEM); "MEM?" where confidence is low. Regulator
// current ranges are left empty: no figure we trust.

import type { ReferenceType } from "../reference-row";
import { H, MERCURY, PRIMING_SOURCE, T } from "./builders";

const low = { source: "REG MEM?" } as const;
const F = (volts: number, amps: number) => H(volts, amps, true);
const EHT = "EHT rectifier of TV sets: very high voltage in use";

export const RECTIFIER_REGULATOR_ROWS: readonly ReferenceType[] = [
  T("5AS4A", "full-wave-rectifier", F(5, 3), "octal", { largeEnvelope: true, ...low }),
  T("5R4GY", "full-wave-rectifier", F(5, 2), "octal", { aliases: ["5R4GYA", "5R4GYB"], largeEnvelope: true }),
  T("5T4", "full-wave-rectifier", F(5, 2), "octal", low),
  T("5V4GA", "full-wave-rectifier", H(5, 2), "octal", { aliases: ["5V4G"], note: "Indirectly heated" }),
  T("5W4GT", "full-wave-rectifier", F(5, 1.5), "octal", low),
  T("5Y4GT", "full-wave-rectifier", F(5, 2), "octal", { note: "A 5Y3GT on other pins" }),
  T("6AX5GT", "full-wave-rectifier", H(6.3, 1.2), "octal"),
  T("1B3GT", "half-wave-rectifier", F(1.25, 0.2), "octal", { note: EHT }),
  T("1G3GTA", "half-wave-rectifier", F(1.25, 0.2), "octal", { aliases: ["1G3GT"], note: EHT, ...low }),
  T("1X2B", "half-wave-rectifier", F(1.25, 0.2), "noval", { aliases: ["1X2A"], note: EHT }),
  T("3A3", "half-wave-rectifier", F(3.15, 0.22), "octal", { aliases: ["3A3A", "3A3B"], note: EHT, ...low }),
  T("872A", "half-wave-rectifier", F(5, 7.5), "four-pin", {
    hazards: [MERCURY],
    largeEnvelope: true,
    note: "Mercury-vapour rectifier, plate on a top cap",
    ...low,
  }),
  T("816", "half-wave-rectifier", F(2.5, 2), "four-pin", {
    hazards: [MERCURY],
    note: "Mercury-vapour rectifier, plate on a top cap",
    ...low,
  }),
  T("0Z4", "full-wave-rectifier", null, "octal", {
    aliases: ["0Z4A"],
    note: "Cold-cathode gas rectifier of car sets",
    ...low,
  }),
  T("0A3", "voltage-regulator", null, "octal", { aliases: ["VR75"], hazards: [PRIMING_SOURCE], source: "MEM" }),
  T("0B3", "voltage-regulator", null, "octal", { aliases: ["VR90"], hazards: [PRIMING_SOURCE], source: "MEM" }),
  T("5651", "voltage-regulator", null, "miniature-7-pin", {
    hazards: [PRIMING_SOURCE],
    note: "Voltage reference, about 87 V",
    source: "MEM?",
  }),
  T("85A2", "voltage-regulator", null, "miniature-7-pin", {
    hazards: [PRIMING_SOURCE],
    note: "Voltage reference, about 85 V",
    source: "MEM?",
  }),
];
