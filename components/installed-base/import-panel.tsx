"use client";

import { useRouter } from "next/navigation";
import { useRef, useState, type DragEvent } from "react";
import { Button } from "@/components/ui/button";
import { Select } from "@/components/ui/field";
import { Table, Td, Th } from "@/components/ui/table";
import { ImportPreview } from "./import-preview";
import type { ImportHistoryRow, ImportResponse } from "./import-types";
import { postForm } from "./upload";

type Phase =
  | { kind: "idle" }
  | { kind: "uploading"; fraction: number }
  | { kind: "checking" }
  | { kind: "error"; message: string };

// The import wizard: pick a file, check it (a dry run), adjust the column mapping or the sheet,
// look at every row with its faults, and commit — all or nothing — when nothing is wrong.
export function ImportPanel({
  siteId,
  history,
  fields,
}: {
  siteId: number;
  history: ImportHistoryRow[];
  fields: { key: string; label: string }[];
}) {
  const router = useRouter();
  const input = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [phase, setPhase] = useState<Phase>({ kind: "idle" });
  const [check, setCheck] = useState<ImportResponse | null>(null);
  const [mapping, setMapping] = useState<Record<string, string>>({});
  const [sheet, setSheet] = useState<string | undefined>();
  const [done, setDone] = useState<string | null>(null);

  async function send(chosen: File, dryRun: boolean, nextMapping = mapping, nextSheet = sheet) {
    const form = new FormData();
    form.set("file", chosen);
    form.set("dryRun", String(dryRun));
    if (Object.keys(nextMapping).length) form.set("mapping", JSON.stringify(nextMapping));
    if (nextSheet) form.set("sheet", nextSheet);
    setPhase({ kind: "uploading", fraction: 0 });
    try {
      const { status, body } = await postForm<ImportResponse>(
        `/api/v1/sites/${siteId}/imports`,
        form,
        (fraction) =>
          setPhase(fraction < 1 ? { kind: "uploading", fraction } : { kind: "checking" }),
      );
      if (!body || (status !== 200 && typeof body.rowsRead !== "number")) {
        setPhase({
          kind: "error",
          message: (body as { error?: string } | null)?.error ?? `The server answered ${status}`,
        });
        return;
      }
      setPhase({ kind: "idle" });
      if (dryRun) {
        setCheck(body);
        return;
      }
      if (status === 200) {
        setDone(
          `Imported ${body.imported} axis rows${body.machinesCreated ? ` and created ${body.machinesCreated} machines` : ""} from ${chosen.name}.`,
        );
        setCheck(null);
        setFile(null);
        // The import ran through a route handler, not a server action: nothing has told the
        // router that the site's pages changed, so it asks for them again.
        router.refresh();
      } else {
        setCheck({ ...check!, ...body });
        setPhase({ kind: "error", message: body.error ?? "Nothing was imported" });
      }
    } catch (error) {
      setPhase({ kind: "error", message: (error as Error).message });
    }
  }

  function choose(chosen: File | undefined) {
    if (!chosen) return;
    setFile(chosen);
    setDone(null);
    setCheck(null);
    setMapping({});
    setSheet(undefined);
    void send(chosen, true, {}, undefined);
  }

  function onDrop(e: DragEvent) {
    e.preventDefault();
    choose(e.dataTransfer.files[0]);
  }

  const busy = phase.kind === "uploading" || phase.kind === "checking";
  return (
    <div className="space-y-5">
      <div
        onDragOver={(e) => e.preventDefault()}
        onDrop={onDrop}
        className="flex flex-wrap items-center justify-between gap-4 rounded-panel border-2 border-dashed border-flux-300 bg-flux-50 p-5"
      >
        <div>
          <p className="font-bold text-flux-900">Drop an .xlsx or .csv file here, or choose one</p>
          <p className="text-small text-steel-700">
            Up to 10 MB and 20,000 rows. Headers name the unit in brackets, e.g.{" "}
            <code>Holding torque [oz·in]</code>. Start from the{" "}
            <a className="font-bold text-flux-700 underline" href="/api/v1/imports/template.xlsx">
              Excel template
            </a>{" "}
            or the{" "}
            <a className="font-bold text-flux-700 underline" href="/api/v1/imports/template.csv">
              CSV template
            </a>
            .
          </p>
        </div>
        <div>
          <label htmlFor="import-file" className="sr-only">
            Spreadsheet to import
          </label>
          <input
            ref={input}
            id="import-file"
            type="file"
            accept=".xlsx,.csv,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
            onChange={(e) => choose(e.target.files?.[0])}
            className="text-small file:mr-3 file:rounded-md file:border-0 file:bg-flux-700 file:px-3 file:py-2 file:font-bold file:text-white"
          />
        </div>
      </div>

      <div aria-live="polite" className="space-y-2">
        {phase.kind === "uploading" ? (
          <div>
            <p className="text-small font-bold">Uploading {file?.name}…</p>
            <progress
              className="w-full"
              max={1}
              value={phase.fraction}
              aria-label="Upload progress"
            />
          </div>
        ) : null}
        {phase.kind === "checking" ? (
          <div>
            <p className="text-small font-bold">Checking every row of {file?.name}…</p>
            <progress className="w-full" aria-label="Checking the file" />
          </div>
        ) : null}
        {phase.kind === "error" ? (
          <p className="rounded-md bg-danger-50 p-3 font-bold text-danger-700">{phase.message}</p>
        ) : null}
        {done ? (
          <p className="rounded-md bg-success-50 p-3 font-bold text-success-700">{done}</p>
        ) : null}
      </div>

      {check && file ? (
        <div className="space-y-5">
          <div className="grid gap-3 sm:grid-cols-4" aria-label="What the check found">
            <Fact label="Rows read" value={check.rowsRead} />
            <Fact label="Valid rows" value={check.rowsValid} />
            <Fact
              label="Problems"
              value={check.errors.length}
              tone={check.errors.length ? "danger" : "ok"}
            />
            <Fact label="New machines" value={check.machinesToCreate.length} />
          </div>
          {check.machinesToCreate.length ? (
            <p className="text-small text-steel-800">
              <strong>Machines this import will create:</strong> {check.machinesToCreate.join(", ")}
            </p>
          ) : null}

          {check.sheets.length > 1 ? (
            <div className="flex items-end gap-2">
              <div>
                <label htmlFor="import-sheet" className="block text-small font-bold">
                  Sheet
                </label>
                <Select
                  id="import-sheet"
                  value={check.sheet}
                  onChange={(e) => (
                    setSheet(e.target.value),
                    void send(file, true, mapping, e.target.value)
                  )}
                  className="w-64"
                >
                  {check.sheets.map((s) => (
                    <option key={s}>{s}</option>
                  ))}
                </Select>
              </div>
            </div>
          ) : null}

          <details open={check.errors.some((e) => e.row === 1)}>
            <summary className="cursor-pointer font-bold text-flux-700">
              Columns and the fields they fill
            </summary>
            <div className="mt-3 grid gap-2 sm:grid-cols-2 lg:grid-cols-3">
              {check.columns.map((c, i) => (
                <div key={i}>
                  <label
                    htmlFor={`map-${i}`}
                    className="block text-caption font-bold text-steel-800"
                  >
                    {c.header || `(column ${i + 1} has no header)`}
                  </label>
                  <Select
                    id={`map-${i}`}
                    value={mapping[c.header] ?? c.key ?? ""}
                    disabled={busy}
                    onChange={(e) => {
                      // Each change of the mapping checks the file again at once, so the rows
                      // and their problems below always match the mapping shown.
                      const next = { ...mapping, [c.header]: e.target.value };
                      setMapping(next);
                      void send(file, true, next);
                    }}
                    className="py-1 text-small"
                  >
                    <option value="">Not imported</option>
                    {fields.map((f) => (
                      <option key={f.key} value={f.key}>
                        {f.label}
                      </option>
                    ))}
                  </Select>
                </div>
              ))}
            </div>
            <p className="mt-3 text-caption text-steel-700">
              Each change checks the file again with the new mapping.
            </p>
          </details>

          {check.preview ? (
            <ImportPreview
              headers={check.preview.headers}
              rows={check.preview.rows}
              errors={check.errors}
            />
          ) : null}

          <div className="flex flex-wrap items-center gap-3">
            <Button
              disabled={busy || check.errors.length > 0 || check.rowsValid === 0}
              onClick={() => void send(file, false)}
            >
              Import {check.rowsValid.toLocaleString("en")} rows
            </Button>
            <p className="text-small text-steel-700">
              {check.errors.length > 0
                ? "Fix the marked cells in your file and choose it again: a file with any error imports nothing."
                : `All rows are valid. The import is all-or-nothing${
                    check.machinesToCreate.length
                      ? ` and creates ${check.machinesToCreate.length} new ${
                          check.machinesToCreate.length === 1 ? "machine" : "machines"
                        } on the way`
                      : ""
                  }.`}
            </p>
          </div>
        </div>
      ) : null}

      <details>
        <summary className="cursor-pointer font-bold text-flux-700">
          Import history ({history.length})
        </summary>
        <div className="mt-3">
          {history.length === 0 ? (
            <p className="text-small text-steel-700">No imports into this site yet.</p>
          ) : (
            <Table caption="Imports into this site">
              <thead>
                <tr>
                  <Th>When (UTC)</Th>
                  <Th>File</Th>
                  <Th>By</Th>
                  <Th className="text-right">Rows read</Th>
                  <Th className="text-right">Imported</Th>
                  <Th className="text-right">Problems</Th>
                </tr>
              </thead>
              <tbody className="divide-y divide-steel-100">
                {history.map((h) => (
                  <tr key={h.id}>
                    <Td className="whitespace-nowrap tabular-nums">
                      {h.at.replace("T", " ").slice(0, 16)}
                    </Td>
                    <Td className="break-all">{h.fileName}</Td>
                    <Td className="break-all">{h.userEmail ?? "—"}</Td>
                    <Td className="text-right tabular-nums">{h.rowsRead}</Td>
                    <Td className="text-right tabular-nums">{h.rowsImported}</Td>
                    <Td
                      className={`text-right tabular-nums ${h.errorCount ? "font-bold text-danger-700" : ""}`}
                    >
                      {h.errorCount}
                    </Td>
                  </tr>
                ))}
              </tbody>
            </Table>
          )}
        </div>
      </details>
    </div>
  );
}

function Fact({ label, value, tone }: { label: string; value: number; tone?: "danger" | "ok" }) {
  const color =
    tone === "danger" ? "text-danger-700" : tone === "ok" ? "text-success-700" : "text-steel-950";
  return (
    <div className="rounded-md border border-steel-200 bg-white p-3">
      <p className="text-caption font-bold text-steel-700">{label}</p>
      <p className={`text-title font-black tabular-nums ${color}`}>{value.toLocaleString("en")}</p>
    </div>
  );
}
