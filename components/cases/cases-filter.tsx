import { ListFilterForm } from "@/components/ui/list-filter-form";
import { CASE_STAGES } from "@/lib/cases/stages";
import { CASE_STAGE_LABELS } from "@/lib/glossary";
import type { CaseListParams } from "@/lib/validations/case-lists";

const STAGE_OPTIONS = CASE_STAGES.map((s) => ({ value: s, label: CASE_STAGE_LABELS[s] }));

// A plain GET form: the filter lands in the URL, the sort stays, the page starts again at 1.
export function CasesFilter({ params }: { params: CaseListParams }) {
  return (
    <ListFilterForm
      action="/cases"
      label="Filter cases"
      className="mb-3"
      search={{
        id: "cases-q",
        label: "Case, account, site or owner contains",
        value: params.q,
        width: "w-64 max-w-full",
      }}
      selects={[
        {
          id: "cases-stage",
          name: "stage",
          label: "Stage",
          value: params.stage,
          anyLabel: "All stages",
          options: STAGE_OPTIONS,
          width: "w-44",
        },
      ]}
      keep={{ sort: params.sort, dir: params.dir }}
      submitLabel="Filter cases"
    />
  );
}
