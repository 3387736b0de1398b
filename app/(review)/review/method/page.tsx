import type { Metadata } from "next";
import { MethodArticle } from "@/components/method/method-article";
import { Breadcrumbs } from "@/components/ui/breadcrumbs";
import { PageHeader } from "@/components/ui/panel";
import { requirePageUser } from "@/server/auth";
import { METHOD_TITLE } from "@/lib/method/model";

export const metadata: Metadata = { title: "Method" };

// The reviewer's copy of the method page: the same text as the vendor's, inside the portal.
export default async function ReviewMethodPage() {
  await requirePageUser("reviewer");
  return (
    <div className="space-y-6">
      <Breadcrumbs
        items={[{ href: "/review", label: "Proposals for review" }, { label: "Method" }]}
      />
      <PageHeader
        title={METHOD_TITLE}
        lead="The model behind the proposals you review: equations, defaults, sources and limits."
      />
      <MethodArticle />
    </div>
  );
}
