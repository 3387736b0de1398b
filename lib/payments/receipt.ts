import "server-only";

export interface DossierReceipt {
  to: string;
  accountName: string;
  caseName: string;
  version: number;
  proposalId: number;
  amount: string;
  currency: string;
  sessionId: string;
  paidAt: string;
  reportUrl: string;
}

/** The receipt's words, kept apart from how it is sent. */
export function receiptText(r: DossierReceipt): { subject: string; text: string } {
  return {
    subject: `Receipt: Loopshift dossier for ${r.caseName} v${r.version}`,
    text: [
      `Thank you for your payment.`,
      ``,
      `Dossier: ${r.caseName}, proposal version ${r.version} (${r.accountName})`,
      `Amount: ${r.amount} ${r.currency}`,
      `Paid: ${r.paidAt.replace("T", " ").slice(0, 16)} UTC`,
      `Reference: ${r.sessionId}`,
      ``,
      `The dossier is unlocked for everyone who works on this account:`,
      r.reportUrl,
      ``,
      `Savings and payback are estimates from the stated assumptions; the dossier lists them all.`,
    ].join("\n"),
  };
}

/**
 * Mails the receipt of a paid dossier. The one place the payment path touches e-mail: it goes
 * through the product's mailer (issue 6) once that lands. Until then it only logs the receipt.
 * TODO(issue 6): send through lib/mail.
 */
export async function sendDossierReceipt(receipt: DossierReceipt): Promise<void> {
  const { subject } = receiptText(receipt);
  console.log(`receipt not mailed yet (no mailer): "${subject}" to ${receipt.to}`);
}
