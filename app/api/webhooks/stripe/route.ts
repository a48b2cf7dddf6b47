// POST /api/webhooks/stripe — payment events from the processor: signature verified on the raw body, handled once
import { NextResponse, type NextRequest } from "next/server";
import { errorResponse } from "@/lib/api/route";
import { ApiError } from "@/lib/api/errors";
import { handleStripeEvent } from "@/lib/services/webhooks";
import { stripe, stripeConfig } from "@/lib/stripe/client";

export async function POST(req: NextRequest) {
  const raw = await req.text();
  const signature = req.headers.get("stripe-signature") ?? "";
  let event;
  try {
    event = stripe().webhooks.constructEvent(raw, signature, stripeConfig().STRIPE_WEBHOOK_SECRET);
  } catch (e) {
    console.warn(`[webhook] refused: bad signature (${(e as Error).message.slice(0, 80)})`);
    return errorResponse(new ApiError("bad_request", "Webhook signature did not verify"));
  }
  try {
    const outcome = await handleStripeEvent(event);
    return NextResponse.json({ received: true, outcome });
  } catch (e) {
    return errorResponse(e);
  }
}
