/**
 * Status words: a dossier payment, a queued e-mail, an axis's loop before and after the retrofit,
 * and a scenario's payback. Keys as db/schema and lib/engine store them.
 */

export type CheckoutStatusKey = "open" | "complete" | "expired";

/** A dossier purchase, as the administrator's payments list shows it. */
export const CHECKOUT_STATUS_LABELS: Record<CheckoutStatusKey, string> = {
  open: "Awaiting payment",
  complete: "Paid",
  expired: "Expired unpaid",
};

export type MailStatusKey = "pending" | "sent";

/** An e-mail in the outbox. */
export const MAIL_STATUS_LABELS: Record<MailStatusKey, string> = {
  pending: "Waiting to be sent",
  sent: "Sent",
};

export type LoopStatusKey = "ok" | "at-risk" | "step-loss" | "undersized";

/** An axis's torque margin open loop today ("step-loss") or closed loop with its kit ("undersized"). */
export const LOOP_STATUS_LABELS: Record<LoopStatusKey, string> = {
  ok: "Margin kept",
  "at-risk": "Thin margin",
  "step-loss": "Loses steps",
  undersized: "Kit too small",
};

export type BandPositionKey = "below" | "within" | "above";

/** Where an energy saving lands against the band the trade claims. */
export const BAND_POSITION_LABELS: Record<BandPositionKey, string> = {
  below: "Below the band",
  within: "Within the band",
  above: "Above the band",
};

export type PaybackStatusKey = "reached" | "beyond-horizon" | "never";

/** Whether a scenario's cumulative cash turns positive, and when (docs/model.md (The business case)). */
export const PAYBACK_STATUS_LABELS: Record<PaybackStatusKey, string> = {
  reached: "Paid back within the horizon",
  "beyond-horizon": "Paid back after the horizon",
  never: "Never paid back",
};
