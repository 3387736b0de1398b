import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { MotorForm } from "@/components/catalogue/motor-form";
import { Badge } from "@/components/ui/badge";
import { PageHeader } from "@/components/ui/panel";
import { listMotors } from "@/db/queries/catalogue";
import { requirePageUser } from "@/server/auth";

export const metadata: Metadata = { title: "Edit a motor" };

export default async function EditMotorPage({ params }: { params: Promise<{ motorId: string }> }) {
  const admin = await requirePageUser("admin");
  const { motorId } = await params;
  if (!/^[1-9]\d*$/.test(motorId)) notFound();
  // The catalogue is a dozen rows: finding the one in the full list keeps a single query path.
  const motor = listMotors(admin, { includeRetired: true }).find((m) => m.id === Number(motorId));
  if (!motor) notFound();
  return (
    <>
      <PageHeader
        title={`Edit motor ${motor.code}`}
        lead="The holding torque is shown in N·m, as saved. Choosing another unit does not convert the number: type the value in that unit."
        actions={motor.active ? null : <Badge tone="caution">Retired</Badge>}
      />
      <MotorForm motor={motor} />
    </>
  );
}
