import { buttonClass } from "@/components/ui/button";
import { Input, Select } from "@/components/ui/field";
import { CASE_STAGES } from "@/lib/cases/stages";
import { CASE_STAGE_LABELS } from "@/lib/glossary";
import type { CaseListParams } from "@/lib/validations/case-lists";

// A plain GET form: the filter lands in the URL, the sort stays, the page starts again at 1.
export function CasesFilter({ params }: { params: CaseListParams }) {
  return (
    <form
      method="get"
      action="/cases"
      role="search"
      aria-label="Filter cases"
      className="mb-3 flex flex-wrap items-end gap-3"
    >
      <div>
        <label htmlFor="cases-q" className="block text-small font-bold text-steel-800">
          Case, account, site or owner contains
        </label>
        <Input id="cases-q" name="q" defaultValue={params.q ?? ""} className="w-64 max-w-full" />
      </div>
      <div>
        <label htmlFor="cases-stage" className="block text-small font-bold text-steel-800">
          Stage
        </label>
        <Select id="cases-stage" name="stage" defaultValue={params.stage ?? ""} className="w-44">
          <option value="">All stages</option>
          {CASE_STAGES.map((s) => (
            <option key={s} value={s}>
              {CASE_STAGE_LABELS[s]}
            </option>
          ))}
        </Select>
      </div>
      <input type="hidden" name="sort" value={params.sort} />
      <input type="hidden" name="dir" value={params.dir} />
      <button type="submit" className={buttonClass("secondary")}>
        Filter cases
      </button>
    </form>
  );
}
