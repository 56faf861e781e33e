/**
 * Pipe friction (Hazen-Williams), mean velocity and elevation pressure. US units: gpm, in, ft, psi.
 */
import { BARM_PER_PSIFT, PSI_PER_FT_WATER, type UnitSystem, fromUS } from "./units";

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

/** The SI rate expressed in psi/ft, for comparing both forms. */
export function frictionRateSIasUS(flowLpm: number, diameterMm: number, cFactor: number): number {
  return frictionRateSI(flowLpm, diameterMm, cFactor) / BARM_PER_PSIFT;
}

/**
 * Friction loss over a length of pipe (Hazen-Williams rate × length).
 *
 * @param flow gpm, @param diameter in, @param cFactor C, @param length ft (pipe plus fitting equivalent length)
 * @returns psi
 * Source: [NFPA 13]. Worked value: 500 gpm, 4.026 in, C 120, 100 ft → 7.18 psi.
 */
export function frictionLoss(flow: number, diameter: number, cFactor: number, length: number): number {
  return frictionRate(flow, diameter, cFactor) * length;
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

/**
 * Friction loss per length in the user's unit system: in US, psi/ft by the NFPA 13 form; in SI, bar/m by the
 * EN 12845 form (the two agree within 0.2 %). Takes US inputs (gpm, in) as the functions layer holds them.
 */
export function frictionRateIn(flowGpm: number, diameterIn: number, cFactor: number, units: UnitSystem): number {
  return units === "SI"
    ? frictionRateSI(fromUS("flow", flowGpm, units), fromUS("diameter", diameterIn, units), cFactor)
    : frictionRate(flowGpm, diameterIn, cFactor);
}
