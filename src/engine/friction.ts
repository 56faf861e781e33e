/**
 * Pipe friction (Hazen-Williams), mean velocity and elevation pressure. US units: gpm, in, ft, psi.
 */
import { BARM_PER_PSIFT, L_PER_GAL, MM_PER_IN, PSI_PER_FT_WATER, type UnitSystem } from "./units";

/** Hazen-Williams exponent of flow and C. [NFPA 13] */
export const HW_FLOW_EXPONENT = 1.85;
/** Hazen-Williams exponent of the internal diameter. [NFPA 13] */
export const HW_DIAMETER_EXPONENT = 4.87;
/** Hazen-Williams constant, US form: psi/ft with Q in gpm and d in in. [NFPA 13] */
export const HW_CONSTANT_US = 4.52;
/** Hazen-Williams constant, SI form: bar/m with Q in L/min and d in mm. [EN 12845] */
export const HW_CONSTANT_SI = 6.05e5;

/**
 * Friction loss per foot of pipe, Hazen-Williams.
 *
 *   p = 4.52 Q^1.85 / (C^1.85 d^4.87)
 *
 * @param flow Q, gpm (≥ 0)
 * @param diameter d, actual internal diameter, in (> 0)
 * @param cFactor C, Hazen-Williams roughness coefficient (> 0)
 * @returns psi per ft of pipe
 * Source: [NFPA 13] hydraulic calculation procedures.
 * Worked value: 500 gpm in 4.026 in (4 in Schedule 40), C 120 → 0.0718 psi/ft.
 */
export function frictionRate(flow: number, diameter: number, cFactor: number): number {
  return (HW_CONSTANT_US * Math.pow(flow, HW_FLOW_EXPONENT)) /
    (Math.pow(cFactor, HW_FLOW_EXPONENT) * Math.pow(diameter, HW_DIAMETER_EXPONENT));
}

/**
 * Friction loss per metre of pipe, Hazen-Williams in the SI form of EN 12845.
 *
 *   p = 6.05e5 Q^1.85 / (C^1.85 d^4.87)
 *
 * @param flowLpm Q, L/min (≥ 0)
 * @param diameterMm d, internal diameter, mm (> 0)
 * @param cFactor C (> 0)
 * @returns bar per m of pipe
 * Source: [EN 12845] hydraulic calculation, Hazen-Williams formula.
 * Worked value: 1892.7 L/min in 102.26 mm, C 120 → 0.01624 bar/m (= 0.0718 psi/ft).
 */
export function frictionRateSI(flowLpm: number, diameterMm: number, cFactor: number): number {
  return (HW_CONSTANT_SI * Math.pow(flowLpm, HW_FLOW_EXPONENT)) /
    (Math.pow(cFactor, HW_FLOW_EXPONENT) * Math.pow(diameterMm, HW_DIAMETER_EXPONENT));
}

/**
 * Hazen-Williams pipe friction in one unit system's published form, on US quantities (gpm, in, ft, psi): the one
 * head-loss interface of the engine. PIPERUN, AREADEMAND, SIZEFOR, FRICTION and the network solver all take their
 * losses from here, so a unit system means one form everywhere.
 */
export interface HeadLoss {
  /** the unit system whose published form this is: "US" the [NFPA 13] form, "SI" the [EN 12845] form */
  readonly units: UnitSystem;
  /** loss per foot of pipe, psi/ft, at `flow` gpm in `diameter` in internal diameter with C `cFactor` */
  rate(flow: number, diameter: number, cFactor: number): number;
  /** loss over `length` ft (pipe plus fitting equivalent length), psi */
  loss(flow: number, diameter: number, cFactor: number, length: number): number;
  /** d(loss)/d(flow) over `length` ft at `flow` gpm, psi per gpm: 1.85 × loss / flow (0 at no flow) */
  slope(flow: number, diameter: number, cFactor: number, length: number): number;
}

/**
 * The [EN 12845] constant carried into US quantities: p[psi/ft] = K·Q[gpm]^1.85 / (C^1.85 d[in]^4.87) with
 * K = 6.05e5 × 3.785411784^1.85 / 25.4^4.87 / (0.0689476 / 0.3048) = 6.05e5 × 11.7357 / 6 942 889 / 0.226206
 * = 4.5209, against the [NFPA 13] 4.52 (the two forms differ by 0.02 %). Derived from the exact unit constants, so the SI form on US quantities is the EN 12845
 * formula on L/min and mm, to rounding.
 */
export const HW_CONSTANT_SI_AS_US =
  (HW_CONSTANT_SI * Math.pow(L_PER_GAL, HW_FLOW_EXPONENT)) / Math.pow(MM_PER_IN, HW_DIAMETER_EXPONENT) / BARM_PER_PSIFT;

function hazenWilliams(units: UnitSystem, constant: number): HeadLoss {
  const rate = (flow: number, diameter: number, cFactor: number) =>
    (constant * Math.pow(flow, HW_FLOW_EXPONENT)) /
    (Math.pow(cFactor, HW_FLOW_EXPONENT) * Math.pow(diameter, HW_DIAMETER_EXPONENT));
  return Object.freeze({
    units,
    rate,
    loss: (flow: number, diameter: number, cFactor: number, length: number) => rate(flow, diameter, cFactor) * length,
    slope: (flow: number, diameter: number, cFactor: number, length: number) =>
      flow > 0 ? (HW_FLOW_EXPONENT * rate(flow, diameter, cFactor) * length) / flow : 0,
  });
}

const HEAD_LOSS: Record<UnitSystem, HeadLoss> = {
  US: hazenWilliams("US", HW_CONSTANT_US),
  SI: hazenWilliams("SI", HW_CONSTANT_SI_AS_US),
};

/**
 * The Hazen-Williams head loss of a unit system: in US work the [NFPA 13] form, in SI work the [EN 12845] form (the
 * two agree within 0.2 %), both on US quantities.
 *
 *   loss = K Q^1.85 / (C^1.85 d^4.87) × L,   d(loss)/dQ = 1.85 loss / Q
 *
 * @param units "US" or "SI"
 * Source: [NFPA 13] (K = 4.52 in psi/ft, gpm, in), [EN 12845] (K = 6.05e5 in bar/m, L/min, mm).
 * Worked value: headLoss("US").loss(500, 4.026, 120, 100) = 0.07178 × 100 = 7.18 psi;
 * slope = 1.85 × 7.178 / 500 = 0.02656 psi per gpm.
 */
export function headLoss(units: UnitSystem): HeadLoss {
  return HEAD_LOSS[units];
}

/**
 * Mean water velocity, v = Q / A, in the trade form v = 0.4085 Q / d².
 *
 * @param flow gpm, @param diameter internal diameter, in
 * @returns ft/s
 * Source: definition (Q / area): 1 gpm = 0.13368 ft³/min; 0.13368 / 60 / (π/4 /144) = 0.4085.
 * Worked value: 500 gpm in 4.026 in → 12.6 ft/s.
 */
export function velocity(flow: number, diameter: number): number {
  const ft3PerSecond = (flow * 231) / 1728 / 60; // 231 in³ per US gallon, 1728 in³ per ft³
  const areaFt2 = (Math.PI / 4) * (diameter / 12) ** 2;
  return ft3PerSecond / areaFt2;
}

/**
 * Pressure to lift water through a rise (a negative rise is a drop and gives a gain).
 *
 *   p = 0.433 × rise
 *
 * @param rise ft (negative for a drop)
 * @returns psi (negative for a drop)
 * Source: [NFPA 13] 0.433 psi per ft. Worked value: 30 ft → 12.99 psi.
 */
export function elevationPressure(rise: number): number {
  return PSI_PER_FT_WATER * rise;
}
