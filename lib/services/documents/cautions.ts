import type { LotHazardFlag } from "../../lots/lot-hazards";
import { HAZARD_CAUTIONS } from "../../valves/hazards";

/**
 * Cautions for paper: glass handling always (every tube is glass or ceramic in a glass-like envelope to pack),
 * then each hazard the lot's types carry or its consignor declared, naming the types.
 */
export function paperCautions(flags: readonly LotHazardFlag[]): { title: string; text: string }[] {
  const out = [{ title: HAZARD_CAUTIONS.glass.title, text: HAZARD_CAUTIONS.glass.caution }];
  for (const f of flags) {
    if (f.kind === "glass" && !f.types.length) continue;
    const types = f.types.map((t) => t.designation).join(", ");
    out.push({ title: types ? `${f.title} (${types})` : f.title, text: f.caution });
  }
  return out;
}
