// GET /api/mediation/queue — claims waiting for a mediator, and the viewer's own cases (mediators only)
import { route } from "@/lib/api/route";
import { mediationQueue } from "@/lib/services/disputes/cases";

export const GET = route({ permission: "disputes.mediate" }, async ({ viewer }) => mediationQueue(viewer));
