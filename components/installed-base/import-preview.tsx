"use client";

import { useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import type { ImportCellError } from "./import-types";

const PAGE = 50;
// Problems listed above the table; the rest are marked in the table itself.
const LISTED = 200;

// Every row of the file as read, faulty cells marked with their message beside the value.
export function ImportPreview({
  headers,
  rows,
  errors,
}: {
  headers: string[];
  rows: string[][];
  errors: ImportCellError[];
}) {
  const [onlyFaulty, setOnlyFaulty] = useState(errors.length > 0);
  const [page, setPage] = useState(0);
  const byCell = useMemo(() => {
    const map = new Map<string, string[]>();
    for (const e of errors)
      map.set(`${e.row}|${e.column}`, [...(map.get(`${e.row}|${e.column}`) ?? []), e.message]);
    return map;
  }, [errors]);
  const faultyRows = useMemo(() => new Set(errors.map((e) => e.row)), [errors]);
  const numbered = rows
    .map((cells, i) => ({ row: i + 2, cells }))
    .filter((r) => r.cells.some((c) => c && c.trim() !== ""));
  const shown = onlyFaulty ? numbered.filter((r) => faultyRows.has(r.row)) : numbered;
  const pages = Math.max(1, Math.ceil(shown.length / PAGE));
  const current = shown.slice(page * PAGE, page * PAGE + PAGE);
  const headerErrors = errors.filter((e) => e.row === 1);
  const rowErrors = errors
    .filter((e) => e.row > 1)
    .sort((a, b) => a.row - b.row || a.column.localeCompare(b.column));

  // Shows the page that holds the row, then scrolls the wide table to it after React renders.
  function goToRow(row: number) {
    const index = shown.findIndex((r) => r.row === row);
    if (index >= 0) setPage(Math.floor(index / PAGE));
    requestAnimationFrame(() => {
      const target = document.getElementById(`import-row-${row}`);
      target?.scrollIntoView({ block: "center" });
      target?.focus();
    });
  }

  return (
    <div className="space-y-3">
      {headerErrors.length ? (
        <ul
          className="rounded-md border border-danger-600 bg-danger-50 p-3 text-small text-danger-700"
          aria-label="Problems with the header row"
        >
          {headerErrors.map((e, i) => (
            <li key={i}>
              <strong>Row 1, {e.column}:</strong> {e.message}
            </li>
          ))}
        </ul>
      ) : null}
      {rowErrors.length ? (
        <div className="rounded-md border border-danger-600 bg-danger-50 p-3 text-small text-danger-700">
          <p className="font-bold">
            {rowErrors.length.toLocaleString("en")} problems in{" "}
            {faultyRows.size.toLocaleString("en")} rows, first to last:
          </p>
          <ul className="mt-1 max-h-48 space-y-0.5 overflow-y-auto" aria-label="Problems by row">
            {rowErrors.slice(0, LISTED).map((e, i) => (
              <li key={i}>
                <button
                  type="button"
                  className="text-left underline hover:no-underline"
                  onClick={() => goToRow(e.row)}
                >
                  Row {e.row}, {e.column}:
                </button>{" "}
                {e.message}
              </li>
            ))}
          </ul>
          {rowErrors.length > LISTED ? (
            <p className="mt-1">
              and {(rowErrors.length - LISTED).toLocaleString("en")} more, marked in the table
            </p>
          ) : null}
        </div>
      ) : null}
      <div className="flex flex-wrap items-center gap-3 text-small">
        <label className="flex items-center gap-2">
          <input
            type="checkbox"
            checked={onlyFaulty}
            onChange={(e) => (setOnlyFaulty(e.target.checked), setPage(0))}
          />
          Show only rows with errors
        </label>
        <span className="text-steel-700">
          {shown.length.toLocaleString("en")} rows shown · page {page + 1} of {pages}
        </span>
        <Button
          size="sm"
          variant="secondary"
          disabled={page === 0}
          onClick={() => setPage(page - 1)}
        >
          Previous
        </Button>
        <Button
          size="sm"
          variant="secondary"
          disabled={page + 1 >= pages}
          onClick={() => setPage(page + 1)}
        >
          Next
        </Button>
      </div>
      <div className="max-h-[32rem] overflow-auto rounded-panel border border-steel-200">
        <table className="min-w-full text-left text-caption">
          <caption className="sr-only">Preview of the rows in the file</caption>
          <thead className="sticky top-0 bg-steel-100">
            <tr>
              <th scope="col" className="px-2 py-1.5 font-bold">
                Row
              </th>
              {headers.map((h, i) => (
                <th key={i} scope="col" className="whitespace-nowrap px-2 py-1.5 font-bold">
                  {h || "(no header)"}
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="divide-y divide-steel-100 bg-white">
            {current.map(({ row, cells }) => (
              <tr
                key={row}
                id={`import-row-${row}`}
                tabIndex={-1}
                className={faultyRows.has(row) ? "bg-danger-50/40" : undefined}
              >
                <th scope="row" className="px-2 py-1 font-bold tabular-nums text-steel-700">
                  {row}
                </th>
                {headers.map((h, i) => {
                  const messages = byCell.get(`${row}|${h}`);
                  return (
                    <td
                      key={i}
                      className={`px-2 py-1 align-top ${messages ? "bg-danger-50 outline outline-1 outline-danger-600" : ""}`}
                    >
                      <span className="whitespace-nowrap">{cells[i] ?? ""}</span>
                      {messages ? (
                        <span
                          className="mt-0.5 block min-w-48 font-bold text-danger-700"
                          data-cell-error={`${row}|${h}`}
                        >
                          {messages.join("; ")}
                        </span>
                      ) : null}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
