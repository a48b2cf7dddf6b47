// POST /api/valves/makers/import?mode=preview|apply — import the maker registry from CSV (text/csv body)
import { z } from "zod";
import { parseWith, readText, route } from "@/lib/api/route";
import { applyRegistryImport, MAX_REGISTRY_CSV_BYTES, previewRegistryImport } from "@/lib/services/makers";

const Query = z.object({ mode: z.enum(["preview", "apply"], { message: "mode is preview or apply" }) });

export const POST = route({ permission: "house.manage" }, async ({ req }) => {
  const { mode } = parseWith(Query, { mode: req.nextUrl.searchParams.get("mode") ?? undefined });
  const csv = await readText(req, { types: ["text/csv", "text/plain"], maxBytes: MAX_REGISTRY_CSV_BYTES });
  return mode === "preview" ? previewRegistryImport(csv) : applyRegistryImport(csv);
});
