import type { Metadata } from "next";
import { DeleteDialog } from "@/components/installed-base/delete-dialog";
import { SiteForm } from "@/components/installed-base/site-form";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { PageHeader, Panel } from "@/components/ui/panel";
import { describeImpact, siteDeletionImpact } from "@/db/queries/installed-base-impact";
import { getSiteOrThrow } from "@/db/queries/sites";
import { requirePageUser } from "@/server/auth";
import { idParam, orNotFound } from "@/lib/pages";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Edit site" };

export default async function EditSitePage({ params }: { params: Promise<{ siteId: string }> }) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const id = idParam((await params).siteId);
  const site = orNotFound(() => getSiteOrThrow(user, id));
  const impact = siteDeletionImpact(user, id);
  return (
    <div className="space-y-6">
      <Breadcrumbs
        items={[
          { href: "/accounts", label: "Accounts" },
          { href: `/accounts/${site.accountId}`, label: site.accountName },
          { href: `/sites/${site.id}`, label: site.name },
          { label: "Edit" },
        ]}
      />
      <PageHeader title={`Edit ${site.name}`} />
      <Panel>
        <SiteForm accountId={site.accountId} site={site} />
      </Panel>
      <Panel title="Delete this site">
        <div className="space-y-3">
          <p className="text-small text-steel-800">{describeImpact(impact)}</p>
          <DeleteDialog
            kind="site"
            id={site.id}
            name={site.name}
            impact={describeImpact(impact)}
            blocked={impact.blockingCaseNames.length > 0}
            afterHref={`/accounts/${site.accountId}`}
          />
        </div>
      </Panel>
    </div>
  );
}
