import { jsonError, withApi } from "@/server/api/handler";
import { BadSignatureError, handlePaymentWebhook } from "@/server/payments/webhook";

// The payment provider's webhook. No session: the signature over the raw body is the proof,
// checked by the SDK's constructEvent; anything that does not verify is refused untouched.
export const POST = withApi(async (request: Request) => {
  const body = await request.text();
  try {
    const recorded = await handlePaymentWebhook(body, request.headers.get("stripe-signature"));
    return Response.json({
      received: true,
      duplicate: recorded.duplicate,
      outcome: recorded.outcome,
    });
  } catch (error) {
    if (error instanceof BadSignatureError)
      return jsonError(400, "The webhook signature does not verify");
    throw error;
  }
});
