import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { KitForm } from "@/components/catalogue/kit-form";
import { Badge } from "@/components/ui/badge";
import { PageHeader } from "@/components/ui/panel";
import { listKits, listMotors } from "@/db/queries/catalogue";
import { requirePageUser } from "@/server/auth";

export const metadata: Metadata = { title: "Edit a kit" };

export default async function EditKitPage({ params }: { params: Promise<{ kitId: string }> }) {
  const admin = await requirePageUser("admin");
  const { kitId } = await params;
  if (!/^[1-9]\d*$/.test(kitId)) notFound();
  // The catalogue is a dozen rows: finding the one in the full list keeps a single query path.
  const kit = listKits(admin, { includeRetired: true }).find((k) => k.id === Number(kitId));
  if (!kit) notFound();
  // Retired motors stay out of the choice, except the one this kit already names.
  const motors = listMotors(admin, { includeRetired: true })
    .filter((m) => m.active || m.id === kit.motorId)
    .map(({ id, code, name, active }) => ({ id, code, name, active }));
  return (
    <>
      <PageHeader
        title={`Edit kit ${kit.code}`}
        lead="Fields left blank take the engine's defaults named under each."
        actions={kit.active ? null : <Badge tone="caution">Retired</Badge>}
      />
      <KitForm kit={kit} motors={motors} />
    </>
  );
}
