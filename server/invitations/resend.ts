import "server-only";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { createInvitation, resendableInvitationOrThrow } from "@/db/queries/invitations";
import type { SessionUser } from "@/lib/auth/session-user";
import { appUrl } from "@/lib/mail/app-url";
import { invitationResentMail } from "@/lib/mail/messages";
import { deliverMail, enqueueMail, type MailDelivery } from "@/server/mail/queue";

export type ResendResult = { email: string; expiresAt: string; mail: MailDelivery };

/**
 * An administrator sends a user who has not chosen a password a new invitation link. Revoking
 * the old link, writing the new one, the audit entry and the message happen in one transaction,
 * so a failure leaves the old link working and no new one half-made; delivery follows the commit.
 */
export async function resendInvitation(caller: SessionUser, userId: number): Promise<ResendResult> {
  const { user, proposalId } = resendableInvitationOrThrow(caller, userId);
  const { expiresAt, mailId } = db.transaction((tx) => {
    const { token, expiresAt } = createInvitation(tx, {
      userId: user.id,
      proposalId,
      createdById: caller.id,
    });
    recordAudit({
      actor: caller,
      action: "invitation.resend",
      targetType: "user",
      targetId: user.id,
      detail: `${user.email}: new invitation link, valid until ${expiresAt.slice(0, 10)}`,
    });
    const mailId = enqueueMail(
      tx,
      { email: user.email, name: user.name },
      invitationResentMail({
        recipientName: user.name,
        senderName: caller.name,
        invitationUrl: appUrl(`/invitation/${token}`),
        expiresAt,
        email: user.email,
      }),
    );
    return { expiresAt, mailId };
  });
  const mail = await deliverMail([mailId]);
  return { email: user.email, expiresAt, mail };
}
