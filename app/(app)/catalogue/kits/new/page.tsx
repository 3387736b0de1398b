import type { Metadata } from "next";
import { KitForm } from "@/components/catalogue/kit-form";
import { PageHeader } from "@/components/ui/panel";
import { listMotors } from "@/db/queries/catalogue";
import { requirePageUser } from "@/server/auth";

export const metadata: Metadata = { title: "Add a kit" };

export default async function NewKitPage() {
  const admin = await requirePageUser("admin");
  // A new kit is offered the motors still in the catalogue, not the retired ones.
  const motors = listMotors(admin).map(({ id, code, name, active }) => ({
    id,
    code,
    name,
    active,
  }));
  return (
    <>
      <PageHeader
        title="Add a kit"
        lead="A closed-loop retrofit kit as cases will propose it. Fields left blank take the engine's defaults named under each."
      />
      <KitForm motors={motors} />
    </>
  );
}
