import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import type { Dossier } from "@/lib/dossier";
import { paybackTone } from "@/lib/results/dossier";
import { formatMoney, formatNumber, formatPayback, formatTempC } from "@/lib/results/format";
import { Term } from "@/components/ui/term";
import { DRIVER_LABELS, SCENARIO_LABELS } from "@/lib/glossary";

const TONE = {
  good: "bg-success-50 text-success-700",
  fair: "bg-white text-steel-900",
  late: "bg-danger-50 text-danger-700",
} as const;

const signed = (pct: number) => `${pct > 0 ? "+" : pct < 0 ? "−" : "±"}${Math.abs(pct)} %`;

export function UncertaintySummary({ dossier }: { dossier: Dossier }) {
  const u = dossier.uncertainty;
  const currency = dossier.result.currency;
  const horizon = dossier.result.scenarios.physics.cashFlows.length - 1;
  return (
    <Panel title="Uncertainty: P10, P50 and P90">
      <div className="grid gap-6 lg:grid-cols-[2fr_3fr]">
        <div className="space-y-3">
          <Table caption="Percentiles of NPV and payback over the draws">
            <thead>
              <tr>
                <Th>Percentile</Th>
                <Th className="text-right">NPV</Th>
                <Th className="text-right">Payback</Th>
              </tr>
            </thead>
            <tbody className="divide-y divide-steel-100">
              {u.percentiles.map((q) => (
                <tr key={q.p} className={q.p === 50 ? "font-bold" : ""}>
                  <Td>P{q.p}</Td>
                  <Td className="text-right tabular-nums">{formatMoney(q.npv, currency)}</Td>
                  <Td className="text-right tabular-nums">
                    {formatPayback(q.paybackYears, horizon)}
                  </Td>
                </tr>
              ))}
            </tbody>
          </Table>
          <p className="text-small text-steel-700">
            P10 of the NPV: 10 % of the draws came out lower. Payback percentiles rank the draws
            from the quickest; {u.drawsWithoutPayback} of {u.draws.length} draws do not pay back
            within {horizon} years. Nearest-rank percentiles over {u.draws.length} draws.
          </p>
        </div>
        <div className="space-y-3">
          <Table caption="Ranges of the draws">
            <thead>
              <tr>
                <Th>Driver</Th>
                <Th className="text-right">Low</Th>
                <Th className="text-right">High</Th>
              </tr>
            </thead>
            <tbody className="divide-y divide-steel-100">
              {(["tariff", "hoursPerYear", "loadTorque", "stepLossEvents"] as const).map((d) => (
                <tr key={d}>
                  <Td>
                    <Term kind="driver">{DRIVER_LABELS[d]}</Term>
                  </Td>
                  <Td className="text-right tabular-nums">{signed(u.ranges[d].lowPct)}</Td>
                  <Td className="text-right tabular-nums">{signed(u.ranges[d].highPct)}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
          <p className="text-small text-steel-700">
            Seed <strong className="tabular-nums">{u.seed}</strong> ({u.generator}): the same seed
            and ranges rebuild the same draws.
          </p>
        </div>
      </div>
    </Panel>
  );
}

export function PaybackGridPanel({ dossier }: { dossier: Dossier }) {
  const grid = dossier.paybackGrid;
  const currency = dossier.result.currency;
  const horizon = dossier.result.scenarios.physics.cashFlows.length - 1;
  // Short paybacks read in months, as on the headline cards; one unit for the whole table.
  const longest = Math.max(0, ...grid.paybackYears.flat().map((y) => y ?? 0));
  const inMonths = longest < 2;
  const cell = (years: number | null) =>
    years === null
      ? "—"
      : inMonths
        ? `${formatNumber(years * 12, 1)} mo`
        : `${formatNumber(years, 2)} y`;
  return (
    <Panel title="Payback over tariff and running hours">
      <p className="mb-3 text-small text-steel-700">
        Simple payback of the {SCENARIO_LABELS.physics.toLowerCase()} with the tariff (rows) and
        every axis&apos;s running hours (columns) changed together. Green: within the first third of
        the {horizon}-year horizon; red: not within it. The framed cell is the case as proposed.
        Paybacks in {inMonths ? "months" : "years"}.
      </p>
      <Table caption="Simple payback by tariff and running hours">
        <thead>
          <tr>
            <Th>Tariff [{currency}/kWh]</Th>
            {grid.hoursPct.map((h) => (
              <Th key={h} className="text-right">
                Hours {signed(h)}
              </Th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-steel-100">
          {grid.tariffPct.map((t, i) => (
            <tr key={t}>
              <Th scope="row" className="whitespace-nowrap">
                {formatNumber(Number(grid.tariffs[i]), 4)} ({signed(t)})
              </Th>
              {grid.paybackYears[i].map((years, j) => {
                const centre = t === 0 && grid.hoursPct[j] === 0;
                return (
                  <Td
                    key={j}
                    className={`text-right tabular-nums ${TONE[paybackTone(years, horizon)]} ${centre ? "font-bold outline outline-2 -outline-offset-2 outline-flux-600" : ""}`}
                  >
                    {cell(years)}
                  </Td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </Table>
    </Panel>
  );
}

export function SensitivitySwingsPanel({ dossier }: { dossier: Dossier }) {
  const currency = dossier.result.currency;
  const horizon = dossier.result.scenarios.physics.cashFlows.length - 1;
  const drivers = dossier.sensitivity[0]?.rows.map((r) => r.driver) ?? [];
  return (
    <Panel title="Sensitivity at ±10, ±20 and ±30 %">
      <p className="mb-3 text-small text-steel-700">
        NPV and simple payback with one driver moved at a time, the others as in the case. Drivers
        ordered by how far ±10 % moves the NPV.
      </p>
      <Table caption="NPV and payback with each driver moved by 10, 20 and 30 %">
        <thead>
          <tr>
            <Th rowSpan={2}>Driver</Th>
            {dossier.sensitivity.map((s) => (
              <Th key={s.swingPct} colSpan={2} className="text-center">
                ±{s.swingPct} %
              </Th>
            ))}
          </tr>
          <tr>
            {dossier.sensitivity.map((s) => [
              <Th key={`${s.swingPct}l`} className="text-right">
                NPV at −
              </Th>,
              <Th key={`${s.swingPct}h`} className="text-right">
                NPV at +
              </Th>,
            ])}
          </tr>
        </thead>
        <tbody className="divide-y divide-steel-100">
          {drivers.map((driver) => (
            <tr key={driver}>
              <Td className="font-bold">
                <Term kind="driver">{DRIVER_LABELS[driver]}</Term>
              </Td>
              {dossier.sensitivity.map((s) => {
                const row = s.rows.find((r) => r.driver === driver)!;
                return [
                  <Td key={`${s.swingPct}l`} className="text-right tabular-nums">
                    {formatMoney(row.low.npv, currency)}
                    <span className="block text-caption text-steel-600">
                      {formatPayback(row.low.paybackYears, horizon)}
                    </span>
                  </Td>,
                  <Td key={`${s.swingPct}h`} className="text-right tabular-nums">
                    {formatMoney(row.high.npv, currency)}
                    <span className="block text-caption text-steel-600">
                      {formatPayback(row.high.paybackYears, horizon)}
                    </span>
                  </Td>,
                ];
              })}
            </tr>
          ))}
        </tbody>
      </Table>
    </Panel>
  );
}

export function AxisStatesPanel({ dossier }: { dossier: Dossier }) {
  return (
    <Panel title="Each axis: currents, losses and temperatures">
      <p className="mb-3 text-small text-steel-700">
        One unit of each axis while moving and holding, today (open loop) and with the kit (closed
        loop). The workbook has a sheet per axis with both torque–speed curves point by point.
        Temperatures are estimates from datasheet values, not measurements.
      </p>
      <Table caption="Currents, losses and winding temperatures per axis and loop">
        <thead>
          <tr>
            <Th rowSpan={2}>Axis</Th>
            <Th colSpan={2} className="text-center">
              Current moving / holding [A]
            </Th>
            <Th colSpan={2} className="text-center">
              Copper loss moving [W]
            </Th>
            <Th colSpan={2} className="text-center">
              Input moving [W]
            </Th>
            <Th colSpan={3} className="text-center">
              Winding temperature [°C]
            </Th>
          </tr>
          <tr>
            {[
              "Open",
              "Closed",
              "Open",
              "Closed",
              "Open",
              "Closed",
              "Open",
              "Closed",
              "Class limit",
            ].map((h, i) => (
              <Th key={i} className="text-right">
                {h}
              </Th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-steel-100">
          {dossier.axes.map((a) => {
            const state = (loop: "open" | "closed", s: "move" | "hold") =>
              a.states.find((x) => x.loop === loop && x.state === s)!;
            const hot = (t: number | null, limit: number) =>
              t === null || t > limit ? "font-bold text-danger-700" : "";
            return (
              <tr key={a.id}>
                <Td>
                  <span className="font-bold">{a.label}</span>
                  <span className="block text-caption text-steel-600">
                    {a.machineName} · ×{a.quantity}
                  </span>
                </Td>
                {(["open", "closed"] as const).map((loop) => (
                  <Td key={loop} className="text-right tabular-nums">
                    {formatNumber(state(loop, "move").currentA, 2)} /{" "}
                    {formatNumber(state(loop, "hold").currentA, 2)}
                  </Td>
                ))}
                {(["open", "closed"] as const).map((loop) => (
                  <Td key={loop} className="text-right tabular-nums">
                    {formatNumber(state(loop, "move").copperLossW, 1)}
                  </Td>
                ))}
                {(["open", "closed"] as const).map((loop) => (
                  <Td key={loop} className="text-right tabular-nums">
                    {formatNumber(state(loop, "move").inputPowerW, 1)}
                  </Td>
                ))}
                {(["open", "closed"] as const).map((loop) => (
                  <Td
                    key={loop}
                    className={`text-right tabular-nums ${hot(a.thermal[loop].windingTempC, a.thermal[loop].classLimitC)}`}
                  >
                    {formatTempC(a.thermal[loop].windingTempC)}
                  </Td>
                ))}
                <Td className="text-right tabular-nums">{a.thermal.open.classLimitC} °C</Td>
              </tr>
            );
          })}
        </tbody>
      </Table>
    </Panel>
  );
}
