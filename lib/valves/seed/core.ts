// Seed rows: the reference table's first 68 rows (see builders.ts for the
// helpers). Values unchanged from the first release, with two fixes: 5Y3GT is
// directly heated (filament) [REG MEM]; the 5AR4 note says higher output
// voltage (lower drop), not higher DC output [MEM].

import type { ReferenceType } from "../reference-row";
import { CORE_PENTODE_ROWS } from "./core-pentodes";
import { CORE_RECTIFIER_ROWS } from "./core-rectifiers";
import { CORE_TRIODE_ROWS } from "./core-triodes";

/**
 * The first reference rows: common receiving, audio, rectifier and regulator
 * types. Two rows (12AX7, 6SN7GT) were checked against published data-sheet
 * transcriptions; the others are registered or data-book figures from memory.
 */
export const CORE_ROWS: readonly ReferenceType[] = [...CORE_TRIODE_ROWS, ...CORE_PENTODE_ROWS, ...CORE_RECTIFIER_ROWS];
