/** A drive's own losses besides the motor's (docs/model.md (Energy and cooling)). */
export interface DriveLosses {
  efficiencyPct: number;
  /** Standby plus, for a kit, the encoder supply. */
  fixedW: number;
}
