import { Badge } from "@/components/ui/badge";
import type { UserRow } from "@/db/queries/users";

const day = (iso: string) =>
  new Date(iso).toLocaleDateString("en-GB", {
    day: "numeric",
    month: "short",
    year: "numeric",
    timeZone: "UTC",
  });

// "Invited" until the user chooses a password (the rule is in db/queries/invitations.ts,
// awaitsFirstPassword), with when the newest link was sent and how long it works.
export function invitationDetail(user: UserRow): string | null {
  if (!user.inviteLink || !user.invitedAt || !user.inviteExpiresAt) return null;
  if (user.inviteLink === "revoked")
    return `Link revoked on ${day(user.inviteRevokedAt!)}; cannot sign in until invited again`;
  if (user.inviteLink === "expired")
    return `Invited on ${day(user.invitedAt)}; link expired on ${day(user.inviteExpiresAt)}`;
  return `Invited on ${day(user.invitedAt)}; link valid until ${day(user.inviteExpiresAt)}`;
}

export function UserStatus({ user }: { user: UserRow }) {
  if (user.status === "inactive") return <Badge tone="danger">Deactivated</Badge>;
  if (user.status === "active") return <Badge tone="success">Active</Badge>;
  return (
    <>
      <Badge tone="caution">Invited</Badge>
      <span className="mt-1 block text-caption text-steel-700">{invitationDetail(user)}</span>
    </>
  );
}
