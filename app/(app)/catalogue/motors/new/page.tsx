import type { Metadata } from "next";
import { MotorForm } from "@/components/catalogue/motor-form";
import { PageHeader } from "@/components/ui/panel";
import { requirePageUser } from "@/server/auth";

export const metadata: Metadata = { title: "Add a motor" };

export default async function NewMotorPage() {
  await requirePageUser("admin");
  return (
    <>
      <PageHeader
        title="Add a motor"
        lead="An open-loop two-phase hybrid stepper motor, from its datasheet. Torque may be typed in any of the listed units; it is saved in N·m."
      />
      <MotorForm />
    </>
  );
}
