// POST /api/lots/:id/import?mode=preview|apply — bulk import of tubes and readings from our CSV format (text/csv)
import { z } from "zod";
import { ApiError } from "@/lib/api/errors";
import { parseParams, parseWith, route } from "@/lib/api/route";
import { DEFAULT_MAX_BYTES } from "@/lib/lots/csv-import";
import { applyImport, previewImport } from "@/lib/services/lot-import";
import { IdParam } from "@/lib/validation/common";

const Query = z.object({
  mode: z.enum(["preview", "apply"], { message: "mode is preview or apply" }),
  name: z.string().max(200).default(""),
});

export const POST = route<{ id: string }>({ permission: "lots.consign" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  const { mode, name } = parseWith(Query, {
    mode: req.nextUrl.searchParams.get("mode") ?? undefined,
    name: req.nextUrl.searchParams.get("name") ?? undefined,
  });
  const type = req.headers.get("content-type") ?? "";
  if (!type.startsWith("text/csv") && !type.startsWith("text/plain"))
    throw new ApiError("unsupported_media_type", "Send the file as text/csv");
  const limit = `The file is larger than ${DEFAULT_MAX_BYTES / 1024 / 1024} MB; split it into smaller files`;
  if (Number(req.headers.get("content-length") ?? 0) > DEFAULT_MAX_BYTES)
    throw new ApiError("payload_too_large", limit);
  const csv = await req.text();
  if (Buffer.byteLength(csv) > DEFAULT_MAX_BYTES) throw new ApiError("payload_too_large", limit);
  return mode === "preview" ? previewImport(viewer, id, csv) : applyImport(viewer, id, csv, name);
});
