import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { namesById } from "@/lib/results/case-view";
import { formatInertia, motionRows } from "@/lib/results/engine-v2";
import { AXIS_FIELDS } from "@/lib/fields";
import { formatNumber, formatPct } from "@/lib/results/format";

/**
 * The duty of the axes described by their mechanism and move (docs/model.md (Motion from the mechanism)), as the engine
 * derived and used it: shown so an engineer can check it against the machine before quoting.
 */
export function MotionTable({ result, input }: { result: CaseResult; input: ParsedCase | null }) {
  const rows = motionRows(result);
  if (rows.length === 0) return null;
  const names = namesById(input);
  return (
    <Panel title="Duty derived from the mechanism">
      <p className="mb-3 text-small text-steel-700">
        For axes described by their mechanism and move: the top speed of the move, the RMS and peak
        torque at the motor shaft, the load held at standstill, the shares of the running hours
        spent moving and holding, the mean mechanical power while moving, and the load inertia seen
        at the motor. These replace typed duty figures in every result.
      </p>
      <Table caption="Duty figures derived from each axis's mechanism and move profile">
        <thead>
          <tr>
            <Th>Axis</Th>
            <Th className="text-right">Speed [rpm]</Th>
            <Th className="text-right">RMS torque [N·m]</Th>
            <Th className="text-right">Peak torque [N·m]</Th>
            <Th className="text-right">{AXIS_FIELDS.holdTorqueNm.label} [N·m]</Th>
            <Th className="text-right">Moving / holding</Th>
            <Th className="text-right">Mech. power [W]</Th>
            <Th className="text-right">Load inertia at motor</Th>
            <Th className="text-right">Inertia ratio</Th>
          </tr>
        </thead>
        <tbody className="divide-y divide-steel-100">
          {rows.map((row) => (
            <tr key={row.axisId}>
              <Td className="min-w-32 font-bold">{names.axisWithMachine(row.axisId)}</Td>
              <Td className="text-right tabular-nums">{formatNumber(row.speedRpm, 0)}</Td>
              <Td className="text-right tabular-nums">{formatNumber(row.loadTorqueNm, 3)}</Td>
              <Td className="text-right tabular-nums">{formatNumber(row.peakTorqueNm, 3)}</Td>
              <Td className="text-right tabular-nums">{formatNumber(row.holdTorqueNm, 3)}</Td>
              <Td className="text-right tabular-nums whitespace-nowrap">
                {formatPct(row.movePct, 0)} / {formatPct(row.holdPct, 0)}
              </Td>
              <Td className="text-right tabular-nums">{formatNumber(row.meanMechPowerW, 1)}</Td>
              <Td className="text-right tabular-nums whitespace-nowrap">
                {formatInertia(row.reflectedInertiaKgM2)}
              </Td>
              <Td className="text-right tabular-nums whitespace-nowrap">{row.inertiaRatioText}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </Panel>
  );
}
