import { describe, expect, it } from "vitest";
import { composeMail, escapeHtml } from "@/lib/mail/layout";
import { decisionMail, dossierReceiptMail, invitationMail } from "@/lib/mail/messages";

const proposal = {
  accountName: "Invented <Plant> & Co",
  caseName: "Line 3",
  version: 2,
  capex: "12345.675",
  currency: "EUR",
  paybackYears: 1.5,
  horizonYears: 5,
};

describe("Loopshift's messages", () => {
  it("carry a plain-text and an HTML part with the same absolute link", () => {
    const url = "https://app.example.com/invitation/abc_DEF-123";
    const mail = invitationMail({
      recipientName: "Pat",
      senderName: "Sam",
      proposal,
      invitationUrl: url,
      expiresAt: "2027-01-08T10:00:00.000Z",
      email: "pat@example.com",
    });
    expect(mail.text).toContain(url);
    expect(mail.html).toContain(`href="${url}"`);
    expect(mail.text).toContain("until 8 January 2027");
    // Money as the screen shows it: rounded half-even to the cent (docs/contracts.md (Numbers and money)).
    expect(mail.text).toContain("€12,345.68");
    expect(mail.text).toContain("1 year 6 months");
  });

  it("say where a sent proposal's value comes from, largest first, with its total and the NPV to the hundred", () => {
    const mail = invitationMail({
      recipientName: "Pat",
      senderName: "Sam",
      proposal,
      value: {
        sources: [
          { label: "Added output", amount: "18000" },
          { label: "Cabinet cooling", amount: "-10.625" },
        ],
        total: "17989.375",
        npv: "14249.99",
        mostlyTypedPct: 99,
      },
      invitationUrl: "https://app.example.com/invitation/x",
      expiresAt: "2027-01-08T10:00:00.000Z",
      email: "pat@example.com",
    });
    expect(mail.text).toContain(
      "Where the value comes from, in the engineering estimate over 5 years, before discounting:\n\nAdded output: €18,000.00\nCabinet cooling: -€10.62\nAll sources: €17,989.38\nNet present value: €14,200",
    );
    expect(mail.text).toContain("99 % of this value rests on figures typed for this case");
    expect(mail.html).toContain("Net present value");
    // Without a breakdown (a result from before value by source), the message says nothing of it.
    const plain = invitationMail({
      recipientName: "Pat",
      senderName: "Sam",
      proposal,
      invitationUrl: "https://app.example.com/invitation/x",
      expiresAt: "2027-01-08T10:00:00.000Z",
      email: "pat@example.com",
    });
    expect(plain.text).not.toContain("Where the value comes from,");
  });

  it("escape what users typed in the HTML part, and keep it verbatim in the text part", () => {
    const mail = decisionMail({
      recipientName: "Sam",
      reviewerName: "<script>alert(1)</script>",
      decision: "changes",
      comment: 'Use "our" tariff & <b>six</b> years',
      proposal,
      proposalUrl: "https://app.example.com/proposals/7",
    });
    expect(mail.html).not.toContain("<script>");
    expect(mail.html).not.toContain("<b>six</b>");
    expect(mail.html).toContain("&lt;b&gt;six&lt;/b&gt;");
    expect(mail.html).toContain("Invented &lt;Plant&gt; &amp; Co");
    expect(mail.text).toContain('> Use "our" tariff & <b>six</b> years');
    expect(mail.subject).toBe("<script>alert(1)</script> asked for changes to Line 3, version 2");
  });

  it("end with the safety line in both parts", () => {
    const mail = composeMail("S", "H", [{ kind: "paragraph", text: "x" }]);
    expect(mail.text).toMatch(/qualified persons only/);
    expect(mail.html).toMatch(/qualified persons only/);
    expect(escapeHtml(`'"&<>`)).toBe("&#39;&quot;&amp;&lt;&gt;");
  });

  it("give the dossier's buyer a receipt: amount, UTC time, reference and the absolute link", () => {
    const url = "https://app.example.com/dossiers/42";
    const mail = dossierReceiptMail({
      recipientName: "Sam",
      accountName: "Invented <Plant> & Co",
      caseName: "Line 3",
      version: 2,
      amount: "1490.5",
      currency: "CHF",
      paidAt: "2027-03-04T23:59:30.000Z",
      reference: "cs_test_abc123",
      dossierUrl: url,
    });
    expect(mail.subject).toBe("Receipt for the dossier of Line 3, version 2");
    expect(mail.text).toContain(`Open the dossier:\n${url}`);
    expect(mail.html).toContain(`href="${url}"`);
    // Money as the screen shows it, never through a float: CHF has two minor digits (ISO 4217).
    expect(mail.text).toContain("Amount paid: CHF");
    expect(mail.text).toContain("1,490.50");
    // The time in UTC, whatever the server's zone.
    expect(mail.text).toContain("Paid: 4 March 2027 at 23:59 UTC");
    expect(mail.text).toContain("Payment reference: cs_test_abc123");
    expect(mail.html).toContain("Invented &lt;Plant&gt; &amp; Co");
  });
});
