import type { Metadata } from "next";
import { SalesSettingsForm } from "@/components/admin/sales-settings-form";
import { PageHeader, Panel } from "@/components/ui/panel";
import { getSalesSettings } from "@/db/queries/sales-settings";
import { requirePageUser } from "@/server/auth";

export const metadata: Metadata = { title: "Sales settings" };

export default async function SalesSettingsPage() {
  await requirePageUser("admin");
  const { isDefault, ...values } = getSalesSettings();
  return (
    <div className="space-y-6">
      <PageHeader
        title="Sales settings"
        lead="When a discount needs a manager's approval, and how the pipeline weighs each stage."
      />
      <Panel title={isDefault ? "Settings (starting values, not saved yet)" : "Settings"}>
        <SalesSettingsForm values={values} />
      </Panel>
    </div>
  );
}
