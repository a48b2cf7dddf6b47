// POST /api/valves/grade — readings in; grades, counts and matched pairs and quads out
import { ApiError } from "@/lib/api/errors";
import { readJson, route } from "@/lib/api/route";
import { gradeBatch } from "@/lib/valves/grade-batch";
import { GradingInputError } from "@/lib/valves/grading";
import { MatchingInputError } from "@/lib/valves/matching";
import { GradeRequestSchema } from "@/lib/validation/valves";

export const POST = route({ public: true }, async ({ req }) => {
  const input = await readJson(req, GradeRequestSchema, 2 * 1024 * 1024);
  try {
    return gradeBatch(input);
  } catch (e) {
    if (e instanceof GradingInputError || e instanceof MatchingInputError)
      throw new ApiError("validation_failed", e.message);
    throw e;
  }
});
