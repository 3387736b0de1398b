import type { Metadata } from "next";
import { EmptyState, PageHeader } from "@/components/ui/panel";
import { getAccountOrThrow } from "@/db/queries/accounts";
import { requirePageUser } from "@/lib/auth";

export const metadata: Metadata = { title: "Proposals for review" };

export default async function ReviewHome() {
  const user = await requirePageUser("reviewer");
  const account = user.accountId ? getAccountOrThrow(user, user.accountId) : null;
  return (
    <>
      <PageHeader
        title="Proposals for review"
        lead={`Retrofit proposals sent to ${account?.name ?? "your company"}. Check the payback, try your own tariff or discount rate, and decide.`}
      />
      <EmptyState title="No proposals have been sent to you yet">
        When your supplier sends a proposal, it appears here and you receive an e-mail with a link.
      </EmptyState>
    </>
  );
}
