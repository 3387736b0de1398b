import { CAUTIONS } from "@/lib/results/warnings";
import type { MethodSection } from "./types";

/**
 * How Loopshift computes its figures, in our own words: the text of the method page in the app
 * and of docs/model.md (generated from this file by `npm run docs:model`). The normative
 * specification is the shared engine model; this is its explanation for engineers and finance
 * reviewers. Keep it in step with lib/engine when the model changes.
 */

export const METHOD_TITLE = "How Loopshift computes its figures";

export const METHOD_LEAD =
  "Every figure in a case comes from the datasheet values, drive settings, duty and prices entered for it, through the steps below. Nothing is measured on the machine: the results are estimates, and each one can be traced back to an input.";

export const METHOD_SECTIONS: MethodSection[] = [
  {
    id: "overview",
    title: "What is compared",
    blocks: [
      {
        kind: "p",
        text: "Each axis is computed twice: as it runs today, an open-loop two-phase hybrid stepper whose drive pushes its set current regardless of the load, and as it would run with the proposed closed-loop kit, where an encoder (or a sensorless estimate) lets the drive apply field-oriented control and feed only the current the load asks for. Both are evaluated at the same speed, load and duty, so that every difference comes from the control alone.",
      },
      {
        kind: "p",
        text: "For each loop the model finds the torque the motor can give at the operating speed, the current it draws while moving and while holding, the temperature the winding settles at, and the electricity it takes over a year. The differences between the two loops become the torque margin freed, the energy and cabinet heat saved and, with the prices of the case, the yearly cash flows of the retrofit.",
      },
      {
        kind: "p",
        text: "Results carry the version of the engine that computed them. A proposal keeps the result it was frozen with: one issued under engine 1.0.0 shows that version and none of the figures engine 2 added (holding capability, derived motion, payback status, break-even values, value by source).",
      },
    ],
  },
  {
    id: "torque-at-speed",
    title: "Torque at speed",
    blocks: [
      {
        kind: "p",
        text: "The motor is treated as a two-phase synchronous machine with equal inductance on both axes; detent and reluctance torque are left out. One constant links torque to current: the datasheet holding torque is produced by two phases at rated current, a current vector of √2 times the rated current, so",
      },
      {
        kind: "eq",
        lines: [
          "k_{1} = T_{H} / (√2 · I_{R})        torque per ampere of current vector, N·m/A",
          "E = k_{1} · ω_{m}        back-EMF amplitude per phase, ω_{m} = 2π·n/60",
          "ω_{e} = N_{r} · ω_{m},   X = ω_{e} · L,   Z = √(R² + X²)        N_{r} rotor teeth (50 for a 1.8° motor)",
        ],
      },
      {
        kind: "p",
        text: "In a frame turning with the rotor the phase current is a vector i = i_{d} + j·i_{q}; only its quadrature part i_{q} makes torque, T = k_{1}·i_{q}. The winding needs the voltage v = (R + jX)·i + jE, and the drive has two limits: the current may not exceed its limit I_{lim}, and the voltage may not exceed the bus voltage V, taken as the per-phase peak.",
      },
      {
        kind: "p",
        text: "Drawn in the plane of (i_{d}, i_{q}), each limit is a disc. The current limit is the disc of radius I_{lim} around the origin. The voltage limit is the disc of radius V/Z around the point",
      },
      {
        kind: "eq",
        lines: ["c = (−E·X/Z², −E·R/Z²)"],
      },
      {
        kind: "p",
        text: "which moves away from the origin as the speed rises. The torque available at speed n is k_{1} times the highest i_{q} that lies in both discs. Because the two boundaries are circles, that point is found without iteration: it is the top of the current circle if the voltage disc contains it, the top of the voltage circle if the current disc contains it, or else the higher of the two points where the circles cross. Iron losses (a hysteresis term proportional to the electrical frequency and an eddy term proportional to its square) act as a drag torque that is subtracted.",
      },
      {
        kind: "eq",
        lines: [
          "T(n) = max(0, k_{1} · i_{q,max}(n) − P_{fe}(n)/ω_{m}),   P_{fe} = k_{h}·f_{e} + k_{e}·f_{e}²,   f_{e} = N_{r}·n/60",
          "T(0) = k_{1} · min(I_{lim}, V/R)",
        ],
      },
      {
        kind: "p",
        text: "The current angle is free. Letting the current lead the rotor (a negative i_{d}, field weakening) keeps current flowing after the back-EMF has passed the bus voltage, which is why a NEMA 23 motor on 24 V still has torque at 1,000 rpm and more. An open-loop rotor falls back to that best angle of its own accord until it pulls out; a field-oriented drive commands it. Engine 1.0.0 held the current in phase with the back-EMF and lost all torque far too early.",
      },
      {
        kind: "p",
        text: "Taking the bus voltage as the peak phase voltage is the limit of linear modulation in two H-bridges. A chopper driven into saturation reaches somewhat more, bridge drops take a volt or two: near the knee of the curve the figure is fair and slightly optimistic.",
      },
    ],
  },
  {
    id: "loops",
    title: "Open loop and closed loop",
    blocks: [
      {
        kind: "p",
        text: "Open loop, today: the current limit is the set current, scaled by the step mode. In full and half steps the phase current is a staircase; the torque while running comes from its fundamental, the sine wave of the same period that the staircase contains. At standstill what counts is the vector the drive actually holds.",
      },
      {
        kind: "table",
        caption:
          "By step mode: the current vector at rest and while running, and the copper loss, for a per-phase setting I",
        head: ["step mode", "vector at rest", "vector while running", "copper loss"],
        rows: [
          ["full step, two phases on", "√2·I", "(4/π)·I ≈ 1.273·I", "2·I²·R"],
          [
            "half step (at rest the weaker single-phase step decides)",
            "I",
            "(4/π)·sin 67.5°·I ≈ 1.176·I",
            "1.5·I²·R",
          ],
          [
            "half step, compensated (two-phase steps at 71 %)",
            "I",
            "(8/π)·sin 22.5°·I ≈ 0.975·I",
            "I²·R",
          ],
          ["microstep (sine and cosine)", "I", "I", "I²·R"],
          ["closed loop, field-oriented", "—", "—", "(i_{d}² + i_{q}²)·R"],
        ],
      },
      {
        kind: "p",
        text: "A microstep setting given as RMS is turned into a peak by √2. When a measured pull-out curve is entered for today's drive, it replaces the model for the open loop: it is read by straight lines between its points, forced never to rise with speed, and held flat beyond its ends (a warning says when the operating speed lies beyond them).",
      },
      {
        kind: "p",
        text: "A mid-band resonance can be entered as a speed range and a derating. From the start of the range upward, the open-loop torque is capped at the derated torque of the range (every move to such a speed passes through it). The closed loop damps resonance and gets no derating; that is common practice rather than a published figure.",
      },
      {
        kind: "p",
        text: "Closed loop: the same machine model with the kit's motor (a new one, or the axis's own), the kit's peak current and the kit's bus voltage (the axis's when the kit gives none). When the kit keeps the axis's motor on the same bus and a pull-out curve is known, the closed loop is credited at least what the curve shows, scaled down when the kit's current is below today's running current: what the motor did open loop, it does closed loop too.",
      },
    ],
  },
  {
    id: "motion",
    title: "Motion from the mechanism",
    blocks: [
      {
        kind: "p",
        text: "Instead of typing speed and torques, an axis can be described by its mechanism (belt, rack and pinion, screw, or rotary table) and its move: stroke, move time, share of the move spent accelerating, dwell, whether it returns, and what it carries. The engine then derives the duty and uses it in everything that follows.",
      },
      {
        kind: "eq",
        lines: [
          "k = r (belt, rack),   k = p/(2π) (screw)        metres of travel per radian of the mechanism shaft",
          "θ = G · s / k (linear),   θ = G · s (rotary, in radians)        motor angle of one move, G the gear ratio",
          "t_{a} = share · t,   ω_{peak} = θ / (t − t_{a}),   α = ω_{peak} / t_{a}        trapezoidal profile",
        ],
      },
      {
        kind: "p",
        text: "The speed used for the axis is the top speed of the move, where the motor has the least torque to spare. The load's inertia is moved to the motor shaft through the transmission and the gear, and divided by the efficiency:",
      },
      {
        kind: "eq",
        lines: [
          "J_{refl} = (J_{load} + m·k²) / G²,   J = J_{rotor} + J_{refl}/η",
          "inertia ratio = J_{refl} / J_{rotor}",
        ],
      },
      {
        kind: "p",
        text: "The force against the motion is gravity along the incline, friction on the normal force, and any process force, with standard gravity g = 9.80665 m/s². Going up, gravity opposes the move; coming back, it helps. Where the motor drives, its torque is the force times k over G, divided by the efficiency; where the load drives, the mechanism's losses work in the motor's favour instead. A screw that cannot be back-driven (back-driving efficiency 2 − 1/η at or below zero) still needs the motor to drive it down, and holds its load by itself at rest.",
      },
      {
        kind: "p",
        text: "Each move has three stretches of constant torque: accelerating (load torque plus J·α), cruising, and braking (load torque minus J·α). From them come",
      },
      {
        kind: "eq",
        lines: [
          "T_{RMS} = √( Σ T_{i}²·t_{i} / Σ t_{i} )        the load torque that heats the winding",
          "T_{peak} = max |T_{i}|        the torque the margin is checked against",
          "P_{mech} = Σ max(0, T_{i}·Δθ_{i}) / t_{moving}        braking energy is lost in the drive, not returned",
          "T_{hold} = m·g·sin(incline)·k / G        no credit for friction or efficiency at rest",
        ],
      },
      {
        kind: "p",
        text: "The shares of the running hours spent moving and holding follow from the move and dwell times, scaled by the share of the hours in which the axis cycles at all. A rotor inertia left at zero means it is unknown: the rotor's own accelerating torque is then missing from the peak, and the axis is flagged. A load-to-rotor ratio above the limit (ten to one by default, common practice for open-loop steppers) is flagged too.",
      },
    ],
  },
  {
    id: "currents",
    title: "Currents at the operating point",
    blocks: [
      {
        kind: "p",
        text: "Each loop has three states over the running hours: moving, holding (energized at standstill) and off. The currents are found in two passes, because the hot winding resistance changes what the drive can push, and the temperature depends on the currents.",
      },
      {
        kind: "list",
        items: [
          "Pass one ignores the voltage limit while moving, gives each loop a first winding temperature and with it a hot resistance.",
          "Pass two places the moving current at the operating speed with that resistance: an open-loop drive that runs short of voltage cannot keep its set current, so it draws less than its setting and loses less in copper (which honestly shrinks the saving); a closed-loop drive adds the least field-weakening current that still lets it drive the torque current the load needs.",
          "The temperature is then solved once more with the pass-two currents; that temperature and resistance give the final losses and torque.",
        ],
      },
      {
        kind: "p",
        text: "Open loop, the current does not depend on the load: the set current while moving, the idle share of it while holding, none when off. Closed loop, the torque current is the load torque (plus iron drag) divided by the torque constant, never below the kit's floor current and never above its maximum; a demand above the maximum marks the kit as too small for the axis.",
      },
      {
        kind: "eq",
        lines: [
          "i_{q} = clamp((T_{load} + T_{drag}) / k_{1}, I_{min}, I_{max})        moving, closed loop",
          "i_{q,hold} = max(I_{min}, T_{hold} / k_{1})        holding, closed loop",
        ],
      },
      {
        kind: "p",
        text: "A sensorless kit has no back-EMF to read at standstill, so it holds the way the open loop does today. Below its minimum estimating speed it does not really close the loop: it runs at full current, keeps the open-loop margin and avoids no lost steps. When the duty comes from a mechanism, both loops are taken at the move's top speed throughout; that can only make the saving look smaller than it is, never larger.",
      },
    ],
  },
  {
    id: "temperature",
    title: "Winding temperature",
    blocks: [
      {
        kind: "p",
        text: "A motor's thermal time constant is tens of minutes, far longer than a machine cycle, so the winding settles at the temperature set by the loss averaged over the running hours. Copper resistance rises with temperature (annealed copper, α = 0.00393 per kelvin at 20 °C), and with it the loss, so the balance is solved in closed form:",
      },
      {
        kind: "eq",
        lines: [
          "R(T) = R_{20} · (1 + α·(T − 20))",
          "A = R_{20} · (m·c_{f}·I_{move}² + h·c_{f}·I_{hold}²),   B = m·P_{fe}",
          "T_{w} = [T_{amb} + R_{th}·(B + A·(1 − 20α))] / (1 − α·A·R_{th})",
        ],
      },
      {
        kind: "p",
        text: "Here m and h are the moving and holding shares and c_{f} the copper factor of the step mode. If the denominator is zero or negative the winding has no steady state (thermal runaway) and the loop is flagged. Without a thermal resistance from the datasheet, it is derived from the rated temperature rise so that two phases at rated current in 20 °C air reproduce exactly that rise with the winding hot (common practice):",
      },
      {
        kind: "eq",
        lines: ["R_{th} = ΔT_{rated} / (2 · I_{R}² · R_{20} · (1 + α·ΔT_{rated}))"],
      },
      {
        kind: "p",
        text: "The temperature is compared with the insulation class (B 130 °C, F 155 °C, H 180 °C). The insulation life gained is 2 raised to the temperature drop divided by the halving interval, 10 K by default: a rule of thumb, since each insulation material has its own interval, so the interval is an input of the case. Where either winding would settle above the melting point of copper (1084.62 °C) the steady state is the model's arithmetic rather than a winding that could exist, and no life factor is given (shown as not meaningful); the temperatures themselves are still reported and flagged.",
      },
    ],
  },
  {
    id: "energy",
    title: "Energy and cooling",
    blocks: [
      {
        kind: "p",
        text: "While moving, the motor takes the mechanical power plus iron and copper losses; while holding, copper loss only. The drive adds its own losses through its efficiency, and a standby draw in every state (the kit also an encoder's few tenths of a watt). The mechanical power is the same in both loops, so it never shows up as a saving.",
      },
      {
        kind: "eq",
        lines: [
          "P_{in} = P_{motor} / η_{drive} + P_{standby} (+ P_{encoder})",
          "E = hours · ((1 − m − h)·P_{in,off} + m·P_{in,move} + h·P_{in,hold}) / 1000        kWh per year",
          "E_{cooling} = hours · (mean drive loss) / 1000 / COP        zero without active cooling",
        ],
      },
      {
        kind: "p",
        text: "The drive's losses are heat in the cabinet; when the case names a cooler's coefficient of performance, removing that heat costs electricity too. The saving of each axis is compared with the band the trade claims for closed-loop retrofits (25 to 50 % by default); a saving outside it is flagged, not corrected.",
      },
    ],
  },
  {
    id: "margins",
    title: "Torque margin and speed",
    blocks: [
      {
        kind: "eq",
        lines: [
          "margin = 100 · (1 − T_{peak} / T(n))        %",
          "usable torque = T(n) · (1 − required margin / 100)",
        ],
      },
      {
        kind: "p",
        text: "Open loop, an axis needs a fat margin (40 % by default) because a lost step goes unnoticed; closed loop, a small one (15 %) is enough because the drive sees and corrects the position. Both defaults are common practice. An open-loop margin below zero means the axis loses steps; a closed-loop one means the kit is too small. Torque freed is the usable torque gained.",
      },
      {
        kind: "p",
        text: "The highest speed at which each loop still covers the peak torque with its margin kept is found by halving the interval from 0 to 6,000 rpm until it is narrower than 0.01 rpm. The speed headroom is how much faster than today the axis could run closed loop. The open-loop load angle, asin(load torque / torque at speed) in electrical degrees, shows how close the rotor runs to pulling out: beyond 90° electrical, one full step, it falls out of step.",
      },
    ],
  },
  {
    id: "holding",
    title: "Holding at standstill",
    blocks: [
      {
        kind: "p",
        text: "At rest today's drive holds with its idle current, so what it can hold is the torque constant times the vector at rest times the idle share. The pull-out curve plays no part here.",
      },
      {
        kind: "eq",
        lines: ["holding capability = k_{1} · (vector at rest) · idle %/100"],
      },
      {
        kind: "p",
        text: "When the load at rest exceeds it, the axis cannot hold its load today and is flagged. A closed-loop drive holds with the current the load needs; a sensorless one cannot see a slip at rest. Either way a loaded vertical axis needs its brake and a safe-stop concept.",
      },
    ],
  },
  {
    id: "business-case",
    title: "The business case",
    blocks: [
      {
        kind: "p",
        text: "Money is computed in exact decimals and rounded only for display and in the workbook, half to even at the currency's minor unit.",
      },
      {
        kind: "list",
        items: [
          "Up-front cost (capex in the formulas): for every axis unit, the kit price after discount, the installation hours at the labour rate and the commissioning cost; plus the downtime hours of each machine at the downtime rate, and the project's one-time cost.",
          "Cost of one lost-step event: entered directly, or built from the minutes of downtime, the parts scrapped and the labour hours of a restart.",
          "Avoided events are valued only on axes whose kit is big enough and that really close the loop.",
          "Added output: a machine's throughput gain is capped by the least speed headroom of its axes, and is worth the gain times the margin of one hour of output times its running hours.",
        ],
      },
      {
        kind: "eq",
        lines: [
          "P_{t} = (ΔE + ΔE_{cooling}) · tariff · (1 + esc)^{t−1} + (reliability + maintenance + output − service) · (1 + infl)^{t−1}",
          "dep_{t} = capex / depreciation years   (for t within the depreciation period, else 0)",
          "CF_{t} = P_{t} − tax · (P_{t} − dep_{t}),   CF_{0} = −capex",
        ],
      },
      {
        kind: "p",
        text: "With a tax rate of 0 the flows are before tax. A negative tax in a year is a shield that the rest of the business uses, as is usual in project appraisal. Depreciation is straight-line over the whole investment without salvage; what remains after the horizon is not written off.",
      },
      {
        kind: "eq",
        lines: [
          "NPV = CF_{0} + Σ CF_{t} / (1 + r)^{t}",
          "IRR: the rate at which NPV = 0, found by halving between −99 % and 1,000 %",
          "payback = (t − 1) + (what was still open after year t − 1) / CF_{t}        for the first year t the running sum turns non-negative",
          "ROI = 100 · Σ CF_{t} / capex        all years including year 0",
        ],
      },
      {
        kind: "p",
        text: "The discounted payback does the same with discounted flows. A payback is within the horizon, after the horizon (not reached yet, but the last year still adds money), or never (the last year adds nothing). Three scenarios are computed: the engineering estimate (this model's own energy saving), and the low and high trade claims, the two ends of the claimed band, which assume that fraction of today's drive and cooling energy is saved.",
      },
      {
        kind: "p",
        text: "Value by source splits each year's flow into drive energy, cabinet cooling, lost steps avoided, maintenance, added output, service of the closed-loop fleet and tax; the seven add up to the year's cash flow exactly, so finance can reconcile every line.",
      },
      {
        kind: "p",
        text: "Break-even. The NPV is a straight line in the tariff and in the number of lost-step events, so two evaluations give where it crosses zero. The break-even tariff is the price of electricity below which the case stops paying; when the case pays even at a tariff of zero it reads “pays back even with free energy”. The step-loss factor is the share of the entered events that must really be avoided (0.3× means three in ten); when the case pays with none, it reads “pays back without any avoided step-loss events”.",
      },
      {
        kind: "eq",
        lines: [
          "tariff_{BE} = t_{0} − NPV(t_{0}) / (NPV(t_{0} + 1) − NPV(t_{0}))",
          "factor_{BE} = −NPV(0) / (NPV(1) − NPV(0))",
        ],
      },
      {
        kind: "p",
        text: "Sensitivity moves one driver at a time up and down by the case's swing (20 % by default) and evaluates the whole case again: tariff, running hours, load torque on every axis, kit price, labour rate, lost-step events, discount rate, throughput gain and idle current. The tornado chart sorts them by how far they move the NPV. CO₂ avoided is the energy saved times the grid's emission factor.",
      },
    ],
  },
];

export interface DefaultRow {
  setting: string;
  value: string;
  basis: string;
}

/** Defaults of the input, with what each rests on; "common practice" has no single source. */
export const METHOD_DEFAULTS: DefaultRow[] = [
  {
    setting: "Required margin, open loop",
    value: "40 % of the torque at speed",
    basis: "common practice (30–50 %)",
  },
  { setting: "Required margin, closed loop", value: "15 %", basis: "common practice (10–20 %)" },
  {
    setting: "Claimed energy band",
    value: "25–50 %",
    basis: "claim made in the trade; compared with, never used as physics",
  },
  {
    setting: "Insulation life halving",
    value: "every 10 K",
    basis: "rule of thumb; each material has its own interval",
  },
  {
    setting: "Thermal resistance when not given",
    value: "from the rated rise with the winding hot",
    basis: "common practice",
  },
  { setting: "Rated temperature rise", value: "80 K", basis: "default of the input" },
  {
    setting: "Mechanism efficiency",
    value: "belt 95 %, rack 90 %, screw 90 %, rotary 100 %",
    basis: "common practice",
  },
  {
    setting: "Largest load-to-rotor inertia ratio",
    value: "10 : 1",
    basis: "common practice for open-loop steppers",
  },
  {
    setting: "Braking energy",
    value: "lost in the drive",
    basis: "common practice for small drives without a regenerative supply",
  },
  { setting: "Resonance in closed loop", value: "damped, no derating", basis: "common practice" },
  {
    setting: "Negative tax in a year",
    value: "a shield used by the rest of the business",
    basis: "common practice in project appraisal",
  },
  {
    setting: "Idle current at standstill",
    value: "50 % of the setting",
    basis: "default of the input",
  },
  {
    setting: "Drive efficiency and standby",
    value: "today 90 %, 2 W; kit 92 %, 3 W, encoder 0.5 W",
    basis: "default of the input",
  },
  {
    setting: "Kit floor current; sensorless minimum speed",
    value: "10 % of the maximum; 60 rpm",
    basis: "default of the input",
  },
  { setting: "Ambient temperature", value: "40 °C", basis: "default of the input" },
  { setting: "Discount rate; horizon", value: "8 %; 5 years", basis: "default of the input" },
  { setting: "Sensitivity swing", value: "±20 %", basis: "default of the input" },
];

export interface SourceRow {
  check: string;
  value: string;
  source: string;
}

/** The outside values the engine is checked against, each with where it comes from. */
export const METHOD_SOURCES: SourceRow[] = [
  {
    check: "Torque units to N·m",
    value: "ozf·in 7.061552·10⁻³, lbf·in 0.1129848, lbf·ft 1.355818, kgf·cm 0.0980665",
    source: "NIST SP 811, Appendix B",
  },
  {
    check: "Inertia units to kg·m²",
    value: "lb·ft² 4.214011·10⁻², lb·in² 2.926397·10⁻⁴, oz·in² 1.828997·10⁻⁵, kg·cm² 10⁻⁴",
    source: "NIST SP 811, Appendix B",
  },
  {
    check: "Standard gravity",
    value: "9.80665 m/s² (exact)",
    source: "CGPM 1901; NIST SP 330 and SP 811",
  },
  {
    check: "Copper temperature coefficient",
    value: "0.00393 per K at 20 °C",
    source: "International Annealed Copper Standard, IEC 60028",
  },
  {
    check: "Insulation class limits",
    value: "B 130 °C, F 155 °C, H 180 °C",
    source: "IEC 60085, Table 1",
  },
  {
    check: "Winding temperature from resistance",
    value: "θ₂ = (R₂/R₁)·(235 + θ₁) − 235",
    source: "IEC 60034-1, resistance method",
  },
  {
    check: "Insulation life halving",
    value: "about every 10 K",
    source: "rule of thumb; IEC 60216 gives each material its own",
  },
  {
    check: "Full step, electrical cycle",
    value: "1.8° and 7.2° for 50 rotor teeth",
    source: "textbook relation; fact of the trade",
  },
  {
    check: "Largest stable load angle",
    value: "90° electrical, one full step",
    source: "fact of the trade",
  },
  {
    check: "Fundamental of stepped currents",
    value: "1.2732·I, 1.1763·I, 0.9745·I",
    source: "Fourier series of a staircase wave (textbook)",
  },
  {
    check: "Torque at speed, best current angle",
    value: "(V·E/Z − E²·R/Z²)/ω_{m}",
    source: "steady-state phasor result — from memory",
  },
  {
    check: "Reflected inertia, screw torque, trapezoidal move, RMS torque",
    value: "m·r², m·(p/2π)², F·p/(2π·η), s/(t − t_{a})",
    source: "textbook kinematics and machine design",
  },
  {
    check: "Back-driving efficiency of a screw",
    value: "≈ 2 − 1/η",
    source: "textbook approximation — from memory",
  },
  {
    check: "Hot-surface burn thresholds",
    value: "about 65–70 °C for 1 s, 55 °C for 10 s",
    source: "EN ISO 13732-1 — from memory, not confirmed",
  },
  {
    check: "Cabinet cooler efficiency",
    value: "COP about 1–2",
    source: "DIN 3168 rating points — from memory",
  },
  {
    check: "Torque margins",
    value: "open loop 30–50 %, closed loop 10–20 %",
    source: "common practice",
  },
  {
    check: "Mechanism efficiencies; inertia ratio",
    value: "belt 95 %, screw and rack 90 %; about 10 : 1",
    source: "common practice",
  },
  { check: "Closed-loop energy gains", value: "25–50 %", source: "claim made in the trade" },
  {
    check: "IRR of −100, 39, 59, 55, 20",
    value: "28.095 %",
    source: "numpy-financial irr documentation",
  },
  {
    check: "NPV at 8 % of −40000, 5000, 8000, 12000, 30000",
    value: "3065.22",
    source: "numpy-financial npv documentation",
  },
  {
    check: "Spreadsheet NPV and IRR examples",
    value: "NPV 49.43; IRR 11.33 %",
    source: "LibreOffice Calc help, NPV and IRR",
  },
  {
    check: "Straight-line depreciation",
    value: "(cost − salvage) / life",
    source: "LibreOffice Calc help, SLN",
  },
];

/** What the model does not do; read every figure with these in mind. */
export const METHOD_LIMITS: string[] = [
  "Steady state only: temperatures are the settled values over the duty mix, currents and torques those at constant speed. Transients, warm-up and start-stop heating are not modelled.",
  "No magnetic saturation, equal inductance on both axes, no detent or reluctance torque: the machine model is linear in current.",
  "The whole move is taken at its top speed, which understates the saving of both loops rather than overstating it.",
  "Estimates, not measurements: every figure follows from datasheet values, drive settings and duty figures as entered. Measure temperatures and currents on site before relying on them.",
  "The drive's voltage limit is the linear-modulation limit of the bus; real drives differ by a few volts near the knee of the curve.",
  "Cash flows are yearly and end with the horizon: nothing after it is counted, not even the part of the investment not yet depreciated.",
  "Savings and payback hold only for the assumptions stated in the case; the workbook lists all of them.",
];

/** The cautions every case carries, in the words the results use. */
export const METHOD_CAUTIONS: string[] = [
  CAUTIONS.general,
  CAUTIONS.holdingLoad,
  `${CAUTIONS.hotWinding} ${CAUTIONS.estimates}`,
  "Local electrical and machinery-safety codes and licensed practice take precedence over anything in this model.",
];
