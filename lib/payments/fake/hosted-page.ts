import type { FakeSession } from "./sessions";

const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!,
  );

/** Minor units back to an amount for display (the fake knows only 0- and 2-decimal currencies). */
function amountText(session: FakeSession): string {
  const zeroDecimal = ["jpy", "krw", "vnd", "clp", "isk", "ugx", "xaf", "xof"].includes(
    session.currency,
  );
  const value = zeroDecimal
    ? String(session.amount_total)
    : (session.amount_total / 100).toFixed(2);
  return `${value.replace(/\B(?=(\d{3})+(?!\d))/g, ",")} ${session.currency.toUpperCase()}`;
}

const STYLE = `
*{box-sizing:border-box}body{margin:0;font:16px/1.5 system-ui,-apple-system,"Segoe UI",sans-serif;color:#1d2733;background:#eef1f5}
.test{background:#fdf0c4;border-bottom:2px solid #c99a06;color:#5c4500;padding:10px 16px;font-size:14px;text-align:center}
.test strong{letter-spacing:.04em}
main{max-width:440px;margin:40px auto;padding:0 16px}
.card{background:#fff;border:1px solid #d5dbe3;border-radius:10px;padding:28px;box-shadow:0 2px 10px rgba(20,40,70,.06)}
.seller{font-size:13px;text-transform:uppercase;letter-spacing:.08em;color:#5b6878;margin:0}
h1{font-size:20px;margin:4px 0 2px}.amount{font-size:30px;font-weight:700;margin:8px 0 20px;font-variant-numeric:tabular-nums}
label{display:block;font-weight:600;font-size:14px;margin:14px 0 4px}
input{width:100%;padding:10px 12px;border:1px solid #aab4c1;border-radius:6px;font:inherit;font-variant-numeric:tabular-nums}
input:focus{outline:3px solid #8fb3e8;border-color:#2f62b0}
.row{display:flex;gap:12px}.row>div{flex:1}
button{margin-top:22px;width:100%;padding:12px;border:0;border-radius:6px;background:#1f4f96;color:#fff;font:inherit;font-weight:700;cursor:pointer}
button:hover{background:#183f78}
.error{margin:0 0 16px;padding:10px 12px;border-left:4px solid #b3261e;background:#fbeaea;color:#7a1712;border-radius:4px}
.done{margin:0 0 8px;padding:10px 12px;border-left:4px solid #2b7a3d;background:#e8f4ea;color:#1b4d27;border-radius:4px}
.cancel{display:block;text-align:center;margin-top:16px;color:#1f4f96}
.hint{font-size:13px;color:#5b6878;margin-top:18px}
`;

export interface HostedPageState {
  error?: string;
  values?: { card?: string; expiry?: string; cvc?: string; name?: string };
}

/** The hosted checkout page of the local fake: of our own design, plainly marked as test mode. */
export function hostedPage(session: FakeSession, state: HostedPageState = {}): string {
  const name = session.line_items_summary[0]?.name ?? "Payment";
  const v = state.values ?? {};
  const closed =
    session.status === "complete"
      ? `<p class="done" role="status">This checkout has been paid. You can close this page.</p>`
      : session.status === "expired"
        ? `<p class="error" role="alert">This checkout was cancelled or has expired; nothing was charged.</p>`
        : "";
  const form =
    session.status !== "open"
      ? ""
      : `<form method="post" action="/pay/${session.id}" novalidate>
  ${state.error ? `<p class="error" role="alert">${escapeHtml(state.error)}</p>` : ""}
  <label for="card">Card number</label>
  <input id="card" name="card" inputmode="numeric" autocomplete="cc-number" placeholder="4242 4242 4242 4242" value="${escapeHtml(v.card ?? "")}" required>
  <div class="row"><div><label for="expiry">Expiry (MM/YY)</label>
  <input id="expiry" name="expiry" inputmode="numeric" autocomplete="cc-exp" placeholder="12/34" value="${escapeHtml(v.expiry ?? "")}" required></div>
  <div><label for="cvc">Security code</label>
  <input id="cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" placeholder="123" value="${escapeHtml(v.cvc ?? "")}" required></div></div>
  <label for="name">Name on card</label>
  <input id="name" name="name" autocomplete="cc-name" value="${escapeHtml(v.name ?? "")}">
  <button type="submit">Pay ${escapeHtml(amountText(session))}</button>
</form>
${session.cancel_url ? `<a class="cancel" href="${escapeHtml(session.cancel_url)}">Cancel and go back</a>` : ""}
<p class="hint">Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined. Any future expiry and any three digits.</p>`;
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Test checkout — ${escapeHtml(name)}</title><style>${STYLE}</style></head><body>
<div class="test" role="note"><strong>TEST MODE</strong> — local test payment service. No card is charged and no money moves.</div>
<main><div class="card">
<p class="seller">Loopshift test checkout</p>
<h1>${escapeHtml(name)}</h1>
<p class="amount">${escapeHtml(amountText(session))}</p>
${closed}${form}
</div></main></body></html>`;
}
