import { ApiError } from "../api/errors";
import { readDateCode, type DateCodeResult } from "../valves/date-code";
import { parseEuropeanDateLine, type EuropeanDateResult } from "../valves/date-line-eu";
import { decodeDesignation } from "../valves/designation";
import type { DateCodeQueryInput } from "../validation/valves";
import type { SourceCodeLookup } from "../valves/source-code";
import { lookupRegisteredCode } from "./makers";
import { referenceFor } from "./valve-types";
import { currentReferenceTable } from "./reference-table";

export type DateCodeAnswer = {
  code: string;
  type: { designation: string; introducedYear?: number; envelopeSuffix?: string } | null;
  eia: DateCodeResult;
  /** Tried when the code looks like an etched European date line (ends in a month letter). */
  european: EuropeanDateResult | null;
  /** The registry's answer for a source code printed with the date, or for three digits that may be one. */
  source: SourceCodeLookup | null;
};

/**
 * Read a code off the glass into ranked dates. With a type, candidates before
 * its introduction or its envelope suffix's era are dropped with reasons.
 */
export async function readCodeForType(q: DateCodeQueryInput): Promise<DateCodeAnswer> {
  let type: DateCodeAnswer["type"] = null;
  if (q.type) {
    const d = decodeDesignation(await currentReferenceTable(), q.type);
    if (!d.ok) throw new ApiError("validation_failed", d.message, { type: d.message });
    const ref = await referenceFor(d.normalised);
    type = {
      designation: d.normalised,
      ...(ref?.introduced ? { introducedYear: ref.introduced.year } : {}),
      ...(d.envelope?.suffix ? { envelopeSuffix: d.envelope.suffix } : {}),
    };
  }
  const ctx = {
    ...(type?.introducedYear ? { introducedYear: type.introducedYear } : {}),
    ...(type?.envelopeSuffix ? { envelopeSuffix: type.envelopeSuffix } : {}),
    ...(q.endOfProduction ? { endOfProductionYear: q.endOfProduction } : {}),
  };
  const eia = readDateCode(q.code, ctx);
  const european = /\d[A-Za-z]\d?$/.test(q.code.trim())
    ? parseEuropeanDateLine(q.code, { ...ctx, schemes: ["A-L", "skip-I"] })
    : null;
  const sourceText = eia.ok ? (eia.sourceCode ?? (eia.flags.includes("may-be-source-code") ? eia.digits : null)) : null;
  const source = sourceText ? await lookupRegisteredCode(sourceText) : null;
  return { code: q.code, type, eia, european, source };
}
