import { DECISION_LABELS, FINANCE_TERMS, SCENARIO_LABELS } from "../glossary";
import { formatMoney, formatMoneyHeadline, formatPayback } from "../results/format";
import { composeMail, type MailBlock, type MailContent } from "./layout";

// The messages Loopshift sends, in its own words. Links are absolute (they are opened from a
// mail program); the caller passes them in so that these stay pure and testable.

export type ProposalFacts = {
  accountName: string;
  caseName: string;
  version: number;
  capex: string;
  currency: string;
  paybackYears: number | null;
  horizonYears: number;
};

/**
 * Where a proposal's value comes from, for the message that sends it (server/proposals/facts.ts
 * proposalValue): the engineering estimate's sources over the horizon, largest first, their
 * total, the net present value and how much of it rests on figures typed for the case.
 */
export type ProposalValue = {
  sources: { label: string; amount: string }[];
  total: string;
  npv: string;
  /** Share of the value over the horizon resting on typed figures, when it is more than half. */
  mostlyTypedPct: number | null;
};

/** The value block of a sent proposal: a controller's first question is where the money comes from. */
function valueBlocks(p: ProposalFacts, v: ProposalValue): MailBlock[] {
  const money = (amount: string) => formatMoney(amount, p.currency);
  const blocks: MailBlock[] = [
    {
      kind: "paragraph",
      text: `Where the value comes from, in the ${SCENARIO_LABELS.physics.toLowerCase()} over ${p.horizonYears} years, before discounting:`,
    },
    {
      kind: "facts",
      rows: [
        ...v.sources.map(({ label, amount }): [string, string] => [label, money(amount)]),
        ["All sources", money(v.total)],
        ["Net present value", formatMoneyHeadline(v.npv, p.currency)],
      ],
    },
  ];
  if (v.mostlyTypedPct !== null)
    blocks.push({
      kind: "note",
      text: `${v.mostlyTypedPct} % of this value rests on figures typed for this case rather than computed by the engine. The proposal lists them, each with its source where one is recorded.`,
    });
  return blocks;
}

function factRows(p: ProposalFacts): [string, string][] {
  return [
    ["Proposal", `${p.caseName}, version ${p.version}`],
    ["For", p.accountName],
    [FINANCE_TERMS.upFrontCost, formatMoney(p.capex, p.currency)],
    [FINANCE_TERMS.estimatedPayback, formatPayback(p.paybackYears, p.horizonYears)],
  ];
}

const dateText = (iso: string) =>
  new Date(iso).toLocaleDateString("en-GB", {
    day: "numeric",
    month: "long",
    year: "numeric",
    timeZone: "UTC",
  });

type SentArgs = {
  recipientName: string;
  senderName: string;
  proposal: ProposalFacts;
  value?: ProposalValue;
};

/** A proposal sent to the customer's reviewer: the same subject, greeting and facts for both. */
function proposalSent(args: SentArgs, invitation: string, rest: MailBlock[]): MailContent {
  const { proposal: p } = args;
  return composeMail(
    `Retrofit proposal for ${p.accountName}: ${p.caseName}, version ${p.version}`,
    `A retrofit proposal is waiting for your review`,
    [
      { kind: "paragraph", text: `Hello ${args.recipientName},` },
      {
        kind: "paragraph",
        text: `${args.senderName} has sent you a proposal to convert open-loop stepper axes to closed-loop control. ${invitation}`,
      },
      { kind: "facts", rows: factRows(p) },
      ...(args.value ? valueBlocks(p, args.value) : []),
      ...rest,
    ],
  );
}

/** To a reviewer who has no password yet: set one through the single-use link, then review. */
export function invitationMail(
  args: SentArgs & { invitationUrl: string; expiresAt: string; email: string },
): MailContent {
  return proposalSent(
    args,
    "You can check the payback and where the value comes from, try your own figures (tariff, running hours, step-loss events and their cost, added output, discount rate, horizon, tax rate), download the workbook, and accept, ask for changes or decline.",
    [
      {
        kind: "paragraph",
        text: `First choose a password for your reviewer account (${args.email}). The link works once and until ${dateText(args.expiresAt)}.`,
      },
      {
        kind: "button",
        label: "Choose a password and open the proposal",
        href: args.invitationUrl,
      },
      {
        kind: "note",
        text: "If you did not expect this message, ignore it: nothing happens until the link is used.",
      },
    ],
  );
}

/**
 * A new invitation link sent by an administrator, for someone who has not chosen a password yet
 * (the first link expired, was lost, or was revoked). Earlier links stop working with it.
 */
export function invitationResentMail(args: {
  recipientName: string;
  senderName: string;
  invitationUrl: string;
  expiresAt: string;
  email: string;
}): MailContent {
  return composeMail("Your new Loopshift invitation link", "A new link to choose your password", [
    { kind: "paragraph", text: `Hello ${args.recipientName},` },
    {
      kind: "paragraph",
      text: `${args.senderName} has sent you a new link to choose a password for your account (${args.email}). The link works once and until ${dateText(args.expiresAt)}. Links in earlier invitations no longer work.`,
    },
    { kind: "button", label: "Choose a password", href: args.invitationUrl },
    {
      kind: "note",
      text: "If you did not expect this message, ignore it: nothing happens until the link is used.",
    },
  ]);
}

/** To a reviewer who already has a password: a new proposal is in their portal. */
export function proposalSentMail(args: SentArgs & { proposalUrl: string }): MailContent {
  return proposalSent(args, "Sign in to check the payback, try your own figures and decide.", [
    { kind: "button", label: "Open the proposal", href: args.proposalUrl },
  ]);
}

export type Decision = "accept" | "changes" | "decline";

const DECISION_WORDS: Record<Decision, string> = {
  accept: "accepted",
  changes: "asked for changes to",
  decline: "declined",
};

/** To the quote's owner at the vendor: the reviewer's decision and comment. */
export function decisionMail(args: {
  recipientName: string;
  reviewerName: string;
  decision: Decision;
  comment: string;
  proposal: ProposalFacts;
  proposalUrl: string;
}): MailContent {
  const { proposal: p } = args;
  const verb = DECISION_WORDS[args.decision];
  return composeMail(
    `${args.reviewerName} ${verb} ${p.caseName}, version ${p.version}`,
    `${args.reviewerName} ${verb} the proposal`,
    [
      { kind: "paragraph", text: `Hello ${args.recipientName},` },
      {
        kind: "paragraph",
        text: `${args.reviewerName} of ${p.accountName} ${verb} version ${p.version} of "${p.caseName}".`,
      },
      ...(args.comment.trim()
        ? [{ kind: "quote" as const, text: args.comment.trim() }]
        : [{ kind: "note" as const, text: "No comment was given." }]),
      { kind: "facts", rows: [["Decision", DECISION_LABELS[args.decision]], ...factRows(p)] },
      { kind: "button", label: "Open the proposal", href: args.proposalUrl },
    ],
  );
}

/** To the other side of a proposal's conversation: a new comment. */
export function commentMail(args: {
  recipientName: string;
  authorName: string;
  body: string;
  proposal: ProposalFacts;
  proposalUrl: string;
}): MailContent {
  const { proposal: p } = args;
  return composeMail(
    `New comment on ${p.caseName}, version ${p.version}`,
    `${args.authorName} commented on the proposal`,
    [
      { kind: "paragraph", text: `Hello ${args.recipientName},` },
      { kind: "quote", text: args.body.trim() },
      { kind: "button", label: "Reply in Loopshift", href: args.proposalUrl },
    ],
  );
}

const dateTimeText = (iso: string) =>
  `${new Date(iso).toLocaleString("en-GB", {
    day: "numeric",
    month: "long",
    year: "numeric",
    hour: "2-digit",
    minute: "2-digit",
    hour12: false,
    timeZone: "UTC",
  })} UTC`;

/** To whoever paid for a proposal's dossier: what was paid, when, its reference and the link. */
export function dossierReceiptMail(args: {
  recipientName: string | null;
  accountName: string;
  caseName: string;
  version: number;
  amount: string;
  currency: string;
  paidAt: string;
  reference: string;
  dossierUrl: string;
}): MailContent {
  return composeMail(
    `Receipt for the dossier of ${args.caseName}, version ${args.version}`,
    "Payment received: the dossier is unlocked",
    [
      { kind: "paragraph", text: args.recipientName ? `Hello ${args.recipientName},` : "Hello," },
      {
        kind: "paragraph",
        text: `Thank you for your payment. The dossier of this proposal is now open to everyone on your side who works on ${args.accountName}, and to the customer's reviewer the proposal is sent to.`,
      },
      {
        kind: "facts",
        rows: [
          ["Dossier", `${args.caseName}, proposal version ${args.version}`],
          ["For", args.accountName],
          ["Amount paid", formatMoney(args.amount, args.currency)],
          ["Paid", dateTimeText(args.paidAt)],
          ["Payment reference", args.reference],
        ],
      },
      { kind: "button", label: "Open the dossier", href: args.dossierUrl },
      {
        kind: "note",
        text: "Keep this message as your receipt. Savings, payback and the uncertainty ranges in the dossier are estimates from the stated assumptions; the dossier lists them all.",
      },
    ],
  );
}
