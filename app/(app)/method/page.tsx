import type { Metadata } from "next";
import { MethodArticle } from "@/components/method/method-article";
import { PageHeader } from "@/components/ui/panel";
import { requirePageUser } from "@/server/auth";
import { METHOD_TITLE } from "@/lib/method/model";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Method" };

// The vendor's copy of the method page; the reviewer's portal has its own at /review/method,
// so that each shell keeps its role check and its navigation.
export default async function MethodPage() {
  await requirePageUser(...VENDOR_ROLES);
  return (
    <div className="space-y-6">
      <PageHeader
        title={METHOD_TITLE}
        lead="The model behind every case, proposal and dossier: equations, defaults, sources and limits."
      />
      <MethodArticle />
    </div>
  );
}
