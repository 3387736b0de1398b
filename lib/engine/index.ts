export {
  caseInputSchema,
  axisInputSchema,
  kitInputSchema,
  motorInputSchema,
  marginsSchema,
  motionInputSchema,
  stepLossEventSchema,
  MECHANISMS,
} from "./schema";
export type {
  AxisInput,
  CaseInput,
  KitInput,
  MarginsInput,
  MotorInput,
  ParsedAxis,
  ParsedCase,
  ParsedKit,
  ParsedMargins,
  ParsedMotor,
  MotionInput,
  ParsedMotion,
  Mechanism,
  StepLossEventInput,
} from "./schema";
export { formatIssues, formatPath } from "./issues";
export { evaluateCase, evaluateParsedCase } from "./evaluate";
export { torqueSpeedCurve } from "./torque-speed-curve";
export { DEFAULT_MECHANISM_EFFICIENCY_PCT } from "./motion";
export { suggestKit, type KitSuggestion } from "./kits";
export { ENGINE_VERSION } from "./version";
export { TORQUE_FACTORS_TO_NM, TORQUE_UNIT_NAMES, type TorqueUnit } from "./units";
export { roundMoney, currencyMinorUnits } from "./money";
export { AXIS_WARNINGS, MACHINE_WARNINGS, type AxisWarning, type MachineWarning } from "./warnings";
export type {
  AxisResult,
  Band,
  CaseResult,
  ClosedLoopResult,
  LoopResult,
  MachineResult,
  OpenLoopResult,
  MotionResult,
  PaybackStatus,
  Scenario,
  ValueSource,
  SensitivityDriver,
  SensitivityRow,
} from "./types";
export {
  prepareCase,
  type PreparedCase,
  type DriverFactors,
  type DriverOutcome,
} from "./prepared-case";
export { breakEven, resultOf, sensitivityOf } from "./evaluate";
export { VALUE_SOURCES } from "./types";
export { SENSITIVITY_DRIVERS } from "./sensitivity";
export {
  valueByMachine,
  type MachineValue,
  type ScenarioValueSplit,
  type SourceYears,
  type ValueByMachine,
} from "./machine-value";
