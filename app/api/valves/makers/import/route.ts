// POST /api/valves/makers/import?mode=preview|apply — import the maker registry from CSV (text/csv body)
import { z } from "zod";
import { ApiError } from "@/lib/api/errors";
import { parseWith, route } from "@/lib/api/route";
import { applyRegistryImport, MAX_REGISTRY_CSV_BYTES, previewRegistryImport } from "@/lib/services/makers";

const Query = z.object({ mode: z.enum(["preview", "apply"], { message: "mode is preview or apply" }) });

export const POST = route({ permission: "house.manage" }, async ({ req }) => {
  const { mode } = parseWith(Query, { mode: req.nextUrl.searchParams.get("mode") ?? undefined });
  const type = req.headers.get("content-type") ?? "";
  if (!type.startsWith("text/csv") && !type.startsWith("text/plain"))
    throw new ApiError("unsupported_media_type", "Send the registry as text/csv");
  if (Number(req.headers.get("content-length") ?? 0) > MAX_REGISTRY_CSV_BYTES)
    throw new ApiError("payload_too_large", "The registry file is larger than 512 KB");
  const csv = await req.text();
  return mode === "preview" ? previewRegistryImport(csv) : applyRegistryImport(csv);
});
