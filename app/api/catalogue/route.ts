// GET /api/catalogue — search the public catalogue by type (with equivalents), words and filters; anyone may
import { ApiError } from "@/lib/api/errors";
import { parseWith, route } from "@/lib/api/route";
import { searchCatalogue } from "@/lib/services/catalogue/search";
import { CatalogueQuerySchema, MAX_QUERY_STRING, searchParamsToObject } from "@/lib/validation/catalogue";

export const GET = route({ public: true }, async ({ req }) => {
  if (req.nextUrl.search.length > MAX_QUERY_STRING)
    throw new ApiError("bad_request", `A search address may be at most ${MAX_QUERY_STRING} characters`, {
      q: "Search for fewer words",
    });
  const r = await searchCatalogue(parseWith(CatalogueQuerySchema, searchParamsToObject(req.nextUrl.searchParams)));
  return { lots: r.lots, facets: r.facets, nextCursor: r.nextCursor, term: r.term };
});
