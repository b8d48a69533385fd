import express from "express";
import { EXPIRED_MESSAGE, type PaymentsState } from "./state";
import { money, type Session } from "./types";

function escapeHtml(s: string) {
  return s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
}

/** The hosted checkout page the customer's browser sees: one card form, in test mode. */
function page(session: Session, message?: { tone: "error" | "info"; text: string }) {
  const line = session.line_items_summary[0]!;
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Pay ${escapeHtml(money(session.amount_total, session.currency))} · Test checkout</title>
<style>
:root { color-scheme: light; font-family: system-ui, -apple-system, "Segoe UI", sans-serif; }
body { margin: 0; background: #eef1f4; color: #17202a; }
.bar { background: #1f2a37; color: #fff; padding: 12px 16px; font-size: 14px; }
.bar strong { color: #ffd27a; }
main { max-width: 440px; margin: 24px auto; padding: 0 16px; }
.card { background: #fff; border-radius: 14px; box-shadow: 0 1px 3px rgba(0,0,0,.12); padding: 20px; }
h1 { font-size: 20px; margin: 0 0 4px; }
.amount { font-size: 32px; font-weight: 700; margin: 8px 0 4px; font-variant-numeric: tabular-nums; }
.muted { color: #4b5866; font-size: 14px; margin: 0; }
label { display: block; font-weight: 600; font-size: 14px; margin: 16px 0 6px; }
input { box-sizing: border-box; width: 100%; min-height: 48px; font-size: 18px; padding: 8px 12px; border: 1px solid #8a96a3; border-radius: 10px; }
.row { display: flex; gap: 12px; } .row > div { flex: 1; }
button { width: 100%; min-height: 52px; margin-top: 20px; border: 0; border-radius: 10px; background: #0b6e4f; color: #fff; font-size: 18px; font-weight: 700; cursor: pointer; }
.msg { margin-top: 16px; padding: 12px; border-radius: 10px; font-size: 15px; }
.msg.error { background: #fdecec; border-left: 4px solid #b42318; }
.msg.info { background: #eef4ff; border-left: 4px solid #2f5aa8; }
.cards { font-size: 13px; color: #4b5866; margin-top: 16px; line-height: 1.5; }
a { color: #1f4f99; }
</style></head>
<body>
<div class="bar" role="note"><strong>Test mode.</strong> Local payment stand-in: no real card is charged.</div>
<main>
<div class="card">
  <h1>${escapeHtml(line.name)}</h1>
  ${line.description ? `<p class="muted">${escapeHtml(line.description)}</p>` : ""}
  <p class="amount">${escapeHtml(money(session.amount_total, session.currency))}</p>
  ${message ? `<div class="msg ${message.tone}" role="${message.tone === "error" ? "alert" : "status"}">${escapeHtml(message.text)}</div>` : ""}
  ${session.status === "open" ? `
  <form method="post" action="/pay/${escapeHtml(session.id)}" autocomplete="off">
    <label for="card">Card number</label>
    <input id="card" name="card" inputmode="numeric" placeholder="1234 1234 1234 1234" required>
    <div class="row">
      <div><label for="expiry">Expiry (MM / YY)</label><input id="expiry" name="expiry" placeholder="12 / 34" required></div>
      <div><label for="cvc">Security code</label><input id="cvc" name="cvc" inputmode="numeric" placeholder="123" required></div>
    </div>
    <label for="holder">Name on card</label>
    <input id="holder" name="holder" autocomplete="off">
    <button type="submit">Pay ${escapeHtml(money(session.amount_total, session.currency))}</button>
  </form>
  ` : ""}
  ${session.cancel_url ? `<p class="muted" style="margin-top:14px"><a href="${escapeHtml(session.cancel_url)}">Cancel and go back</a></p>` : ""}
  <p class="cards">Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined. Any future expiry and any 3 digits.</p>
</div>
</main>
</body></html>`;
}

/** GET /pay/:id shows the page; POST /pay/:id pays with the typed card and goes back to the product on success. */
export function checkoutPages(state: PaymentsState) {
  const router = express.Router();
  router.get("/favicon.ico", (_req, res) => {
    res.status(204).end();
  });
  router.get("/pay/:id", (req, res) => {
    const s = state.session(req.params.id);
    if (!s) return res.status(404).type("text/plain").send("This checkout does not exist.");
    if (s.status === "expired") return res.status(410).type("html").send(page(s, { tone: "error", text: EXPIRED_MESSAGE }));
    if (s.status !== "open") return res.redirect(303, s.success_url.replace("{CHECKOUT_SESSION_ID}", s.id));
    res.type("html").send(page(s));
  });
  router.post("/pay/:id", express.urlencoded({ extended: false }), (req, res) => {
    const s = state.session(req.params.id);
    if (!s) return res.status(404).type("text/plain").send("This checkout does not exist.");
    const outcome = state.pay(s.id, String(req.body?.card ?? ""));
    if (outcome.result === "paid") return res.redirect(303, s.success_url.replace("{CHECKOUT_SESSION_ID}", s.id));
    if (outcome.result === "expired") return res.status(410).type("html").send(page(s, { tone: "error", text: EXPIRED_MESSAGE }));
    // Shown on the same page, as a hosted checkout does (a normal 200 page; the outcome is in the words).
    res.status(200).type("html").send(page(s, { tone: "error", text: outcome.message ?? "Payment failed." }));
  });
  return router;
}
