// Hazards a listing must show, with short cautions in our
// own words. Cautions defer to local codes, carriers and licensed practice:
// they are reminders for buyers and sellers, not safety instructions.

import { normaliseDesignation } from "./designation/normalise";
import type { HazardCertainty, HazardKind, TypeHazard } from "./index-types";
import { findReferenceType, type ReferenceTable } from "./reference-table";

/** Title, caution text and source for each hazard kind. */
export interface HazardCaution {
  readonly title: string;
  readonly caution: string;
  readonly source: string;
}

/** Cautions per hazard kind. The glass caution has a stronger form for large envelopes. */
export const HAZARD_CAUTIONS: Readonly<Record<HazardKind, HazardCaution>> = {
  "high-voltage": {
    title: "Lethal voltages when tested or used",
    caution:
      "Testers apply hundreds of volts, amplifier supplies commonly run at 300-700 V DC and transmitters at kilovolts; filter capacitors stay charged after switch-off. Only people competent in high-voltage work should power a valve, following local electrical-safety rules. Sellers are never asked to power equipment.",
    source: "MEM/CTP",
  },
  glass: {
    title: "Glass envelope",
    caution:
      "Glass can crack or shatter. Wear eye protection, hold the valve by its base rather than the top cap, and pack each valve boxed or sleeved with no valve touching another.",
    source: "CTP",
  },
  "beryllium-oxide": {
    title: "Beryllium-oxide ceramic",
    caution:
      "Safe while intact; the dust is toxic. Never break, grind, file or machine it. If a part is damaged, do not handle or clean up the debris yourself: follow local hazardous-material rules and get professional help.",
    source: "MEM, verify",
  },
  radioactive: {
    title: "Radioactive material",
    caution:
      "May hold a small radioactive source, not always marked. Keep the valve intact and do not open it. Shipping and disposal may fall under rules for radioactive material (for example excepted packages, UN2911): check with the carrier and the local regulator.",
    source: "MEM, verify with carrier",
  },
  "mercury-vapour": {
    title: "Mercury",
    caution:
      "Holds liquid mercury. After transport, run the heater alone for the warm-up time on the data sheet before applying high voltage. A broken valve is a mercury spill: ventilate, do not vacuum, and follow local clean-up and disposal rules. Carriers may restrict shipping (for example UN3506): check before sending.",
    source: "MEM, verify",
  },
};

const LARGE_ENVELOPE_CAUTION =
  "Large envelope: breakage can throw glass with force. Wear eye protection, handle by the base, and immobilise it in its packing with at least 5 cm of cushioning all round inside a second box.";

/** One hazard to show on a listing. "always" applies to every valve. */
export interface HazardNotice {
  readonly kind: HazardKind;
  readonly certainty: HazardCertainty | "always" | "declared";
  readonly title: string;
  readonly caution: string;
  readonly source: string;
  /** Type-specific detail, when we have it. */
  readonly note?: string;
}

/** Hazards for one type, and whether we know the type at all. */
export interface HazardReport {
  readonly designation: string;
  readonly known: boolean;
  readonly notices: readonly HazardNotice[];
  /** Shown when the type is not in our lists: specific hazards are unknown. */
  readonly advice?: string;
}

/**
 * Hazards of types outside the reference table that sellers commonly meet.
 * 872A is a mercury-vapour rectifier like 866A.
 */
export const EXTRA_TYPE_HAZARDS: Readonly<Record<string, readonly TypeHazard[]>> = {
  "872A": [{ kind: "mercury-vapour", certainty: "known", note: "Mercury-vapour rectifier", source: "MEM, verify" }],
};

function notice(kind: HazardKind, certainty: HazardNotice["certainty"], note?: string, source?: string): HazardNotice {
  const c = HAZARD_CAUTIONS[kind];
  return { kind, certainty, title: c.title, caution: c.caution, source: source ?? c.source, ...(note ? { note } : {}) };
}

/**
 * Hazards to show for a type: high voltage and glass for every valve (glass
 * stronger for large envelopes), then the type's own hazards from the
 * reference table, then any the seller declared (beryllium oxide, radioactive
 * source...) that our data does not list. Unknown types get the general
 * notices and advice to check the data sheet.
 */
export function hazardsForType(
  table: ReferenceTable,
  designation: string,
  declared: readonly HazardKind[] = [],
): HazardReport {
  const n = normaliseDesignation(designation);
  const key = n.ok ? n.value : designation;
  const found = n.ok ? findReferenceType(table, key) : undefined;
  const row = found?.row;
  const typeHazards: readonly TypeHazard[] = row?.hazards ?? EXTRA_TYPE_HAZARDS[key] ?? [];
  const notices: HazardNotice[] = [notice("high-voltage", "always")];
  notices.push(
    row?.largeEnvelope
      ? {
          ...notice("glass", "always"),
          caution: `${HAZARD_CAUTIONS.glass.caution} ${LARGE_ENVELOPE_CAUTION}`,
          note: "Large envelope",
        }
      : notice("glass", "always"),
  );
  for (const h of typeHazards) notices.push(notice(h.kind, h.certainty, h.note, h.source));
  for (const kind of declared) {
    if (!notices.some((x) => x.kind === kind)) notices.push(notice(kind, "declared", "Declared by the seller"));
  }
  const known = Boolean(row) || key in EXTRA_TYPE_HAZARDS;
  return {
    designation: key,
    known,
    notices,
    ...(known
      ? {}
      : {
          advice:
            "This type is not in our lists, so type-specific hazards are unknown: check its data sheet for beryllium-oxide, radioactive or mercury warnings.",
        }),
  };
}
