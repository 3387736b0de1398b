import { Panel } from "@/components/ui/panel";
import type { AccountPermissions } from "@/lib/accounts/permissions";
import { ArchiveControl } from "./archive-control";
import { ReassignOwnerForm } from "./reassign-owner-form";
import { RenameAccountForm } from "./rename-account-form";
import { ShareList } from "./share-list";

type Person = { id: number; name: string };

// The account page's "Sharing and ownership" panel: each control shows only to the callers the
// queries accept it from (lib/accounts/permissions.ts).
export function SharingPanel({
  account,
  permissions,
  engineers,
}: {
  account: {
    id: number;
    name: string;
    ownerId: number;
    ownerName: string;
    archivedAt: string | null;
    shares: { userId: number; name: string; active: boolean }[];
  };
  permissions: AccountPermissions;
  engineers: Person[];
}) {
  const shared = new Set(account.shares.map((s) => s.userId));
  const others = engineers.filter((e) => e.id !== account.ownerId);
  return (
    <Panel title="Sharing and ownership">
      <div className="space-y-6">
        <p>
          <span className="font-bold">Owner:</span> {account.ownerName}
        </p>
        {permissions.rename ? (
          <RenameAccountForm accountId={account.id} name={account.name} />
        ) : null}
        <section aria-labelledby="shared-with-heading" className="space-y-2">
          <h3 id="shared-with-heading" className="font-bold text-steel-800">
            Shared with
          </h3>
          <ShareList
            accountId={account.id}
            shares={account.shares.map((s) => ({ id: s.userId, name: s.name, active: s.active }))}
            candidates={others.filter((e) => !shared.has(e.id))}
            canShare={permissions.share}
          />
        </section>
        {permissions.reassign ? (
          <section aria-labelledby="reassign-heading" className="space-y-2">
            <h3 id="reassign-heading" className="font-bold text-steel-800">
              Reassign owner
            </h3>
            <ReassignOwnerForm
              accountId={account.id}
              ownerName={account.ownerName}
              candidates={others}
            />
          </section>
        ) : null}
        {permissions.archive ? (
          <section aria-labelledby="archive-heading" className="space-y-2">
            <h3 id="archive-heading" className="font-bold text-steel-800">
              {account.archivedAt ? "Restore" : "Archive"}
            </h3>
            <ArchiveControl
              accountId={account.id}
              name={account.name}
              archived={account.archivedAt !== null}
            />
          </section>
        ) : null}
      </div>
    </Panel>
  );
}
