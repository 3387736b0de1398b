import http from "node:http";
import type { AddressInfo } from "node:net";
import qs from "qs";
import Stripe from "stripe";
import { hostedPage, type HostedPageState } from "./hosted-page";
import {
  FakeApiError,
  TEST_CARDS,
  completeSession,
  completedEvent,
  createSession,
  luhnValid,
  publicSession,
  type FakeSession,
} from "./sessions";

export interface FakePaymentApiOptions {
  /** The key the SDK must present (Authorization: Bearer …). */
  secretKey: string;
  /** Where checkout.session.completed is delivered, and the secret it is signed with. */
  webhookUrl: string;
  webhookSecret: string;
  host?: string;
  port?: number;
}

export interface Delivery {
  eventId: string;
  type: string;
  payload: string;
  signature: string;
  status: number | null;
  at: string;
}

export interface FakePaymentApi {
  host: string;
  port: number;
  /** Base of the hosted pages, as a browser reaches it. */
  url: string;
  deliveries: Delivery[];
  close(): Promise<void>;
}

const MAX_BODY = 1024 * 1024;

function readBody(req: http.IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    let size = 0;
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => {
      size += c.length;
      if (size > MAX_BODY) {
        reject(new FakeApiError(413, "Request body too large"));
        req.destroy();
      } else chunks.push(c);
    });
    req.on("end", () => resolve(Buffer.concat(chunks).toString("utf8")));
    req.on("error", reject);
  });
}

function sendJson(res: http.ServerResponse, status: number, body: unknown) {
  res.writeHead(status, { "content-type": "application/json" });
  res.end(JSON.stringify(body));
}

function sendHtml(res: http.ServerResponse, status: number, html: string) {
  res.writeHead(status, {
    "content-type": "text/html; charset=utf-8",
    "content-security-policy":
      "default-src 'none'; style-src 'unsafe-inline'; form-action 'self' http: https:",
  });
  res.end(html);
}

/** What the hosted form's card fields say, as the customer sees it: a clear message or null. */
function cardProblem(card: string, expiry: string, cvc: string): string | null {
  if (!/^\d{12,19}$/.test(card) || !luhnValid(card))
    return "The card number is not valid. Check the digits and try again.";
  const m = /^(\d{2})\s*\/\s*(\d{2})$/.exec(expiry);
  if (!m || Number(m[1]) < 1 || Number(m[1]) > 12) return "Enter the expiry as MM/YY, e.g. 12/34.";
  const now = new Date();
  const year = 2000 + Number(m[2]);
  if (
    year < now.getUTCFullYear() ||
    (year === now.getUTCFullYear() && Number(m[1]) < now.getUTCMonth() + 1)
  )
    return "The card has expired.";
  if (!/^\d{3,4}$/.test(cvc)) return "The security code is the three or four digits on the card.";
  return null;
}

/**
 * A local stand-in for the payment provider's API, for `npm start` and the tests: the checkout
 * session calls Loopshift makes through the real SDK, a hosted checkout page, and the signed
 * checkout.session.completed webhook. It listens on loopback only and keeps its sessions in memory.
 */
export async function startFakePaymentApi(options: FakePaymentApiOptions): Promise<FakePaymentApi> {
  const sessions = new Map<string, FakeSession>();
  const deliveries: Delivery[] = [];
  const host = options.host ?? "127.0.0.1";
  let base = "";

  async function deliver(session: FakeSession) {
    const event = completedEvent(session, Stripe.API_VERSION);
    const payload = JSON.stringify(event, null, 2);
    // The provider's own signing scheme (t=…,v1=HMAC-SHA256 of "t.payload"), made by the SDK.
    const signature = Stripe.webhooks.generateTestHeaderString({
      payload,
      secret: options.webhookSecret,
    });
    const delivery: Delivery = {
      eventId: event.id,
      type: event.type,
      payload,
      signature,
      status: null,
      at: new Date().toISOString(),
    };
    deliveries.push(delivery);
    // A few attempts, as the real service retries an endpoint that is down.
    for (let attempt = 0; attempt < 4; attempt++) {
      try {
        const res = await fetch(options.webhookUrl, {
          method: "POST",
          headers: { "content-type": "application/json", "stripe-signature": signature },
          body: payload,
          signal: AbortSignal.timeout(15_000),
        });
        delivery.status = res.status;
        await res.arrayBuffer();
        if (res.ok) return;
      } catch {
        delivery.status = null;
      }
      await new Promise((r) => setTimeout(r, 500 * 2 ** attempt));
    }
  }

  function authorised(req: http.IncomingMessage): boolean {
    return req.headers.authorization === `Bearer ${options.secretKey}`;
  }

  async function handleApi(req: http.IncomingMessage, res: http.ServerResponse, path: string) {
    if (!authorised(req))
      throw new FakeApiError(
        401,
        "Invalid API Key provided",
        undefined,
        undefined,
        "invalid_request_error",
      );
    const expire = /^\/v1\/checkout\/sessions\/([\w-]+)\/expire$/.exec(path);
    const one = /^\/v1\/checkout\/sessions\/([\w-]+)$/.exec(path);
    if (path === "/v1/checkout/sessions" && req.method === "POST") {
      const params = qs.parse(await readBody(req), { depth: 6, arrayLimit: 100 });
      const session = createSession(params as Record<string, unknown>, base);
      sessions.set(session.id, session);
      return sendJson(res, 200, publicSession(session));
    }
    if (one && req.method === "GET") {
      const session = sessions.get(one[1]);
      if (!session)
        throw new FakeApiError(
          404,
          `No such checkout.session: '${one[1]}'`,
          "session",
          "resource_missing",
        );
      return sendJson(res, 200, publicSession(session));
    }
    if (expire && req.method === "POST") {
      await readBody(req);
      const session = sessions.get(expire[1]);
      if (!session)
        throw new FakeApiError(
          404,
          `No such checkout.session: '${expire[1]}'`,
          "session",
          "resource_missing",
        );
      if (session.status !== "open")
        throw new FakeApiError(
          400,
          `Only an open session can be expired; this one is ${session.status}.`,
        );
      session.status = "expired";
      return sendJson(res, 200, publicSession(session));
    }
    if (path === "/_fake/deliveries" && req.method === "GET")
      return sendJson(res, 200, { deliveries });
    throw new FakeApiError(404, `Unrecognized request URL (${req.method}: ${path}).`);
  }

  async function handleHosted(req: http.IncomingMessage, res: http.ServerResponse, id: string) {
    const session = sessions.get(id);
    if (!session)
      return sendHtml(res, 404, "<!doctype html><title>Not found</title><p>No such checkout.</p>");
    if (req.method === "GET") return sendHtml(res, 200, hostedPage(session));
    if (req.method !== "POST") return sendHtml(res, 405, "<p>Method not allowed</p>");
    const form = new URLSearchParams(await readBody(req));
    const values = {
      card: form.get("card") ?? "",
      expiry: form.get("expiry") ?? "",
      cvc: form.get("cvc") ?? "",
      name: form.get("name") ?? "",
    };
    if (session.status !== "open") return sendHtml(res, 409, hostedPage(session));
    const card = values.card.replace(/[\s-]/g, "");
    const again = (status: number, error: string, state: HostedPageState = {}) =>
      sendHtml(
        res,
        status,
        hostedPage(session, { error, values: { ...values, cvc: "" }, ...state }),
      );
    const problem = cardProblem(card, values.expiry.trim(), values.cvc.trim());
    if (problem) return again(400, problem);
    if (card === TEST_CARDS.declined)
      return again(402, "Your card was declined. Nothing was charged. Try another card or cancel.");
    if (card !== TEST_CARDS.pays)
      return again(
        402,
        "This test service only knows its test cards: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined.",
      );
    completeSession(session);
    await deliver(session);
    res.writeHead(303, {
      location: session.success_url.replace("{CHECKOUT_SESSION_ID}", session.id),
    });
    res.end();
  }

  const server = http.createServer((req, res) => {
    const path = new URL(req.url ?? "/", "http://fake.invalid").pathname;
    const hosted = /^\/pay\/([\w-]+)$/.exec(path);
    const work = hosted ? handleHosted(req, res, hosted[1]) : handleApi(req, res, path);
    work.catch((error: unknown) => {
      if (res.headersSent) return res.end();
      if (error instanceof FakeApiError) {
        return sendJson(res, error.status, {
          error: { type: error.type, message: error.message, param: error.param, code: error.code },
        });
      }
      console.error(error);
      sendJson(res, 500, { error: { type: "api_error", message: "The local fake failed" } });
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port ?? 0, host, () => resolve());
  });
  const { port } = server.address() as AddressInfo;
  base = `http://${host}:${port}`;
  return {
    host,
    port,
    url: base,
    deliveries,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
