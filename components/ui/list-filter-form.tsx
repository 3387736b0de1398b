import type { ReactNode } from "react";
import { buttonClass } from "@/components/ui/button";
import { Input, Select } from "@/components/ui/field";

const labelClass = "block text-small font-bold text-steel-800";

/** A choice narrowing the list; its first option, with an empty value, means "no filter". */
export type ListFilterSelect = {
  id: string;
  name: string;
  label: string;
  value: string | undefined;
  /** The empty first option, such as "All stages". */
  anyLabel: string;
  options: readonly { value: string | number; label: string }[];
  /** Tailwind width of the control, such as "w-44". */
  width: string;
};

/**
 * The filter above a server-side list (lib/lists/list-params.ts): a plain GET form, so the
 * filter lands in the URL and works without JavaScript. `keep` carries the list state the form
 * does not edit (sort and direction, another list's state on the same page) as hidden fields;
 * leaving the page number out sends the list back to page 1. Extra controls, such as a
 * checkbox, go in `children`, after the selects.
 */
export function ListFilterForm({
  action,
  label,
  className = "",
  search,
  selects = [],
  keep,
  submitLabel,
  children,
}: {
  action: string;
  /** The accessible name of the search landmark, such as "Filter cases". */
  label: string;
  /** Spacing around the form, such as "mb-3". */
  className?: string;
  search: {
    id: string;
    /** The query parameter; "q" unless the page holds two lists. */
    name?: string;
    label: string;
    value: string | undefined;
    /** Tailwind width of the box, such as "w-64". */
    width: string;
  };
  selects?: readonly ListFilterSelect[];
  keep: Record<string, string | undefined>;
  submitLabel: string;
  children?: ReactNode;
}) {
  return (
    <form
      method="get"
      action={action}
      role="search"
      aria-label={label}
      className={`${className ? `${className} ` : ""}flex flex-wrap items-end gap-3`}
    >
      <div>
        <label htmlFor={search.id} className={labelClass}>
          {search.label}
        </label>
        <Input
          id={search.id}
          name={search.name ?? "q"}
          defaultValue={search.value ?? ""}
          className={search.width}
        />
      </div>
      {selects.map((s) => (
        <div key={s.id}>
          <label htmlFor={s.id} className={labelClass}>
            {s.label}
          </label>
          <Select id={s.id} name={s.name} defaultValue={s.value ?? ""} className={s.width}>
            <option value="">{s.anyLabel}</option>
            {s.options.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </Select>
        </div>
      ))}
      {children}
      {Object.entries(keep).map(([name, value]) =>
        value ? <input key={name} type="hidden" name={name} value={value} /> : null,
      )}
      <button type="submit" className={buttonClass("secondary")}>
        {submitLabel}
      </button>
    </form>
  );
}

/** The entries of `current` named in `keys`, for a filter form's `keep`. */
export function pickParams(
  current: Record<string, string | undefined>,
  keys: readonly string[],
): Record<string, string | undefined> {
  return Object.fromEntries(keys.map((k) => [k, current[k]]));
}
