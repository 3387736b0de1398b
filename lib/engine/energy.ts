/** A drive's own losses besides the motor's (docs/model.md §6). */
export interface DriveLosses {
  efficiencyPct: number;
  /** Standby plus, for a kit, the encoder supply. */
  fixedW: number;
}
