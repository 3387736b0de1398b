export interface DutyMix {
  hoursPerYear: number;
  /** Shares of running hours: moving and holding; the rest the motor is de-energized. */
  move: number;
  hold: number;
}

export interface DriveLosses {
  efficiencyPct: number;
  /** Standby plus, for a kit, the encoder supply. */
  fixedW: number;
}

export interface PowerByState {
  move: number;
  hold: number;
  off: number;
}

export const averageOverDuty = (p: PowerByState, duty: DutyMix): number =>
  duty.move * p.move + duty.hold * p.hold + (1 - duty.move - duty.hold) * p.off;

/** E = hoursPerYear·(average input over the duty mix)/1000 (ENGINE.md §6). */
export const kWhPerYear = (averageW: number, duty: DutyMix): number =>
  (duty.hoursPerYear * averageW) / 1000;

/** Cabinet cooler energy for the drive's loss heat, 0 without active cooling. */
export const coolingKWhPerYear = (
  cabinetHeatW: number,
  duty: DutyMix,
  cop: number | null,
): number => (cop === null ? 0 : kWhPerYear(cabinetHeatW, duty) / cop);
