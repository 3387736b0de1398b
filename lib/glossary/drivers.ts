import type { SensitivityDriver } from "@/lib/engine";
import { AXIS_FIELDS } from "@/lib/fields";

/** The sensitivity drivers of docs/model.md (The business case): tornado, dossier tables and sheets. */
export const DRIVER_LABELS: Record<SensitivityDriver, string> = {
  tariff: "Electricity tariff",
  hoursPerYear: "Running hours per year",
  loadTorque: "Load torque on every axis",
  kitPrice: "Kit price",
  laborRate: "Labour rate",
  // The same words as the input field the driver moves (lib/fields).
  stepLossEvents: AXIS_FIELDS.stepLossEventsPerYear.label,
  discountRate: "Discount rate",
  throughputGain: "Throughput gain of every machine",
  idleCurrent: "Idle current at standstill",
};
