import type { CaseInput } from "@/lib/engine";

/** mulberry32: a small deterministic generator, so every run times the same invented fleet. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** An invented fleet: three motor classes, mixed step modes, kits with and without encoders. */
export function inventedFleet(axes: number, machines: number, seed = 1): CaseInput {
  const next = random(seed);
  const pick = <T>(items: readonly T[]): T => items[Math.floor(next() * items.length)];
  const between = (lo: number, hi: number) => lo + (hi - lo) * next();
  const motors = [
    {
      holdingTorqueNm: 0.45,
      ratedCurrentA: 1.7,
      phaseResistanceOhm: 1.5,
      phaseInductanceMh: 2.8,
      hysteresisWPerHz: 0.002,
    },
    {
      holdingTorqueNm: 1.26,
      ratedCurrentA: 2.8,
      phaseResistanceOhm: 0.9,
      phaseInductanceMh: 3.2,
      hysteresisWPerHz: 0.004,
      eddyWPerHz2: 2e-6,
    },
    {
      holdingTorqueNm: 3.5,
      ratedCurrentA: 4.2,
      phaseResistanceOhm: 0.6,
      phaseInductanceMh: 4.5,
      insulationClass: "F" as const,
    },
  ];
  const modes = ["full", "half", "half-compensated", "micro", "micro", "micro"] as const;
  return {
    currency: "EUR",
    finance: {
      tariffPerKWh: "0.22",
      tariffEscalationPct: 2,
      horizonYears: 7,
      laborRatePerHour: "80",
      downtimeCostPerHour: "300",
      coolingCop: 1.5,
      gridKgCo2PerKWh: 0.35,
    },
    machines: Array.from({ length: machines }, (_, i) => ({
      id: `M${i}`,
      name: `Invented machine ${i}`,
      downtimeHours: Math.round(between(1, 8)),
      throughputGainPct: pick([0, 5, 10]),
      marginPerOutputHour: pick(["20", "35.50", "60"]),
    })),
    axes: Array.from({ length: axes }, (_, i) => {
      const size = Math.floor(next() * motors.length);
      const motor = motors[size];
      const load = motor.holdingTorqueNm * between(0.1, 0.45);
      // Every fourth axis is described by its mechanism and move instead of typed figures.
      const motion =
        i % 4 === 0
          ? {
              mechanism: pick(["belt", "screw", "rack"] as const),
              radiusMm: between(8, 20),
              leadMm: pick([5, 10, 20]),
              massKg: between(1, 6) * (size + 1),
              inclineDeg: pick([0, 0, 90]),
              frictionCoeff: 0.05,
              motorInertiaKgM2: [1.2e-5, 4.8e-5, 1.4e-4][size],
              stroke: between(50, 300),
              moveTimeS: between(0.4, 1.2),
              dwellTimeS: between(0.2, 1.5),
            }
          : undefined;
      return {
        id: `A${i}`,
        label: `Axis ${i}`,
        machineId: `M${i % machines}`,
        quantity: pick([1, 1, 1, 2, 4]),
        motor,
        drive: {
          busVoltageV: pick([24, 36, 48]),
          currentSettingA: motor.ratedCurrentA * between(0.7, 1.05),
          stepMode: pick(modes),
        },
        duty: {
          hoursPerYear: pick([2000, 4000, 6000]),
          movePct: Math.round(between(10, 60)),
          holdPct: Math.round(between(10, 40)),
          speedRpm: Math.round(between(30, 900)),
          loadTorqueNm: load,
          peakTorqueNm: load * between(1.2, 2),
          holdTorqueNm: next() < 0.2 ? load * 0.8 : 0,
          ...(motion ? { motion } : {}),
        },
        reliability: {
          stepLossEventsPerYear: pick([0, 1, 4]),
          costPerEvent: pick(["0", "120", "450"]),
        },
        retrofit: {
          kit: {
            id: `K${size}`,
            name: `Invented kit ${size}`,
            price: pick(["129.00", "189.00", "249.00"]),
            sensing: next() < 0.2 ? ("sensorless" as const) : ("encoder" as const),
          },
          installHours: pick([0.5, 1, 1.5]),
          commissioningCost: "25",
        },
      };
    }),
  };
}
