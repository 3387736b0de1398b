import { z } from "zod";
import { CASE_STAGES } from "@/lib/cases/stages";
import { listParamsSchema } from "@/lib/lists/list-params";
import { QUOTE_STAGES } from "@/lib/pipeline/stages";

// The URL state of the cases list and of a case's proposal versions (lib/lists/list-params.ts):
// a stage outside the list is no filter, like any other stale value in a link.

export const CASE_SORTS = ["name", "account", "stage", "axes", "owner", "updated"] as const;
export const caseListParamsSchema = listParamsSchema(CASE_SORTS, {
  sort: "updated",
  dir: "desc",
}).extend({ stage: z.enum(CASE_STAGES).optional().catch(undefined) });
export type CaseListParams = z.output<typeof caseListParamsSchema>;

export const PROPOSAL_SORTS = ["version", "stage", "by"] as const;
export const proposalListParamsSchema = listParamsSchema(PROPOSAL_SORTS, {
  sort: "version",
  dir: "desc",
}).extend({ stage: z.enum(QUOTE_STAGES).optional().catch(undefined) });
export type ProposalListParams = z.output<typeof proposalListParamsSchema>;
