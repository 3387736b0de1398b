import { caseInputSchema } from "@/lib/engine/schema";
const axis = (i: number) => ({
  id: "A" + i, label: "x", machineId: "M" + (i % 300),
  motor: { holdingTorqueNm: 1.26, ratedCurrentA: 2.8, phaseResistanceOhm: 0.9, phaseInductanceMh: 3.2 },
  drive: { busVoltageV: 48, currentSettingA: 2.8 },
  duty: { hoursPerYear: 4000, movePct: 40, holdPct: 30, speedRpm: 300, loadTorqueNm: 0.3, peakTorqueNm: 0.6 },
  retrofit: { kit: { id: "K", name: "k", price: "189.00" }, installHours: 1.5 },
});
const input = { currency: "EUR", finance: { tariffPerKWh: "0.21" }, machines: Array.from({ length: 300 }, (_, i) => ({ id: "M" + i, name: "m" })), axes: Array.from({ length: 10000 }, (_, i) => axis(i)) };
const ts: number[] = [];
for (let k = 0; k < 9; k++) { const t = performance.now(); caseInputSchema.parse(input); ts.push(performance.now() - t); }
console.log(process.argv[2] ?? "", ts.map((x) => x.toFixed(0)).join(" "));
