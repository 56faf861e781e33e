/**
 * Pipe friction (Hazen-Williams), mean velocity and elevation pressure. US units: gpm, in, ft, psi.
 */
import { BARM_PER_PSIFT, L_PER_GAL, MM_PER_IN, PSI_PER_FT_WATER, type UnitSystem } from "./units";

/**
 * Hazen-Williams exponent of flow and C, dimensionless.
 * @see [NFPA 13] Hazen-Williams formula
 */
export const HW_FLOW_EXPONENT = 1.85;
/**
 * Hazen-Williams exponent of the internal diameter, dimensionless.
 * @see [NFPA 13] Hazen-Williams formula
 */
export const HW_DIAMETER_EXPONENT = 4.87;
/**
 * Hazen-Williams constant, US form: psi/ft with Q in gpm and d in in.
 * @see [NFPA 13] Hazen-Williams formula
 */
export const HW_CONSTANT_US = 4.52;
/**
 * Hazen-Williams constant, SI form: bar/m with Q in L/min and d in mm.
 * @see [EN 12845] Hazen-Williams formula
 */
export const HW_CONSTANT_SI = 6.05e5;

/**
 * Friction loss per foot of pipe, Hazen-Williams.
 *
 *   p = 4.52 Q^1.85 / (C^1.85 d^4.87)
 *
 * 500 gpm in 4 in Schedule 40 (4.026 in) at C 120: 4.52 × 500^1.85 / (120^1.85 × 4.026^4.87)
 * = 4.52 × 98 422.5 / (7022.40 × 882.542) = 0.0718 psi/ft.
 *
 * @param flow Q, the flow, gpm (≥ 0)
 * @param diameter d, the actual internal diameter, in (> 0)
 * @param cFactor C, the Hazen-Williams roughness coefficient, dimensionless (> 0)
 * @returns the friction loss, psi per ft of pipe
 * @see [NFPA 13] hydraulic calculation procedures, Hazen-Williams formula
 * @example
 * frictionRate(500, 4.026, 120) // ≈ 0.0718 psi/ft
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
 * 1892.7 L/min (500 gpm) in 102.26 mm (4.026 in) at C 120 gives 0.01624 bar/m, which is 0.0718 psi/ft.
 *
 * @param flowLpm Q, the flow, L/min (≥ 0)
 * @param diameterMm d, the internal diameter, mm (> 0)
 * @param cFactor C, the Hazen-Williams roughness coefficient, dimensionless (> 0)
 * @returns the friction loss, bar per m of pipe
 * @see [EN 12845] hydraulic calculation, Hazen-Williams formula
 * @example
 * frictionRateSI(1892.7, 102.26, 120) // ≈ 0.01624 bar/m
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
 * The [EN 12845] Hazen-Williams constant carried into US quantities: psi/ft with Q in gpm and d in in.
 *
 *   p[psi/ft] = K Q[gpm]^1.85 / (C^1.85 d[in]^4.87)
 *   K = 6.05e5 × 3.785411784^1.85 / 25.4^4.87 / (0.0689476 / 0.3048)
 *     = 6.05e5 × 11.7357 / 6 942 889 / 0.226206 = 4.5209
 *
 * against the [NFPA 13] 4.52 (the two forms differ by 0.02 %). Derived from the exact unit constants, so the SI form
 * on US quantities is the EN 12845 formula on L/min and mm, to rounding.
 *
 * @see [EN 12845] Hazen-Williams formula; definition of the units
 * @example
 * HW_CONSTANT_SI_AS_US // ≈ 4.5209
 */
export const HW_CONSTANT_SI_AS_US =
  (HW_CONSTANT_SI * Math.pow(L_PER_GAL, HW_FLOW_EXPONENT)) / Math.pow(MM_PER_IN, HW_DIAMETER_EXPONENT) / BARM_PER_PSIFT;

/**
 * Hazen-Williams with one constant. A class, not an object of closures: both unit systems' objects share one shape
 * and one set of methods, so that a call site seeing either stays monomorphic and the optimiser inlines it (these
 * run on every recalculation of every friction cell and inside every solve).
 */
class HazenWilliams implements HeadLoss {
  readonly units: UnitSystem;
  private readonly constant: number;
  constructor(units: UnitSystem, constant: number) {
    this.units = units;
    this.constant = constant;
    Object.freeze(this);
  }
  rate(flow: number, diameter: number, cFactor: number): number {
    return (this.constant * Math.pow(flow, HW_FLOW_EXPONENT)) /
      (Math.pow(cFactor, HW_FLOW_EXPONENT) * Math.pow(diameter, HW_DIAMETER_EXPONENT));
  }
  loss(flow: number, diameter: number, cFactor: number, length: number): number {
    return this.rate(flow, diameter, cFactor) * length;
  }
  slope(flow: number, diameter: number, cFactor: number, length: number): number {
    return flow > 0 ? (HW_FLOW_EXPONENT * this.rate(flow, diameter, cFactor) * length) / flow : 0;
  }
}

const HEAD_LOSS: Record<UnitSystem, HeadLoss> = {
  US: new HazenWilliams("US", HW_CONSTANT_US),
  SI: new HazenWilliams("SI", HW_CONSTANT_SI_AS_US),
};

/**
 * The Hazen-Williams head loss of a unit system, on US quantities (gpm, in, ft, psi).
 *
 *   loss = K Q^1.85 / (C^1.85 d^4.87) × L,   d(loss)/dQ = 1.85 loss / Q
 *
 * In US work the [NFPA 13] form, in SI work the [EN 12845] form (the two agree within 0.2 %). 500 gpm in 4.026 in at
 * C 120 over 100 ft: loss = 0.07178 × 100 = 7.18 psi; slope = 1.85 × 7.178 / 500 = 0.02656 psi per gpm.
 *
 * @param units the unit system whose published form is used, "US" or "SI"
 * @returns the head loss: rate in psi/ft, loss in psi, slope in psi per gpm
 * @see [NFPA 13] (K = 4.52 in psi/ft, gpm, in), [EN 12845] (K = 6.05e5 in bar/m, L/min, mm)
 * @example
 * headLoss("US").loss(500, 4.026, 120, 100) // ≈ 7.18 psi
 * headLoss("US").slope(500, 4.026, 120, 100) // ≈ 0.02656 psi per gpm
 * headLoss("SI").rate(500, 4.026, 120) // ≈ 0.0718 psi/ft
 * headLoss("SI").units // → "SI"
 */
export function headLoss(units: UnitSystem): HeadLoss {
  return HEAD_LOSS[units];
}

/**
 * Mean water velocity in a pipe.
 *
 *   v = Q / A = 0.4085 Q / d²
 *
 * 1 gpm = 0.13368 ft³/min; 0.13368 / 60 / (π/4 / 144) = 0.4085. 500 gpm in 4.026 in: 0.4085 × 500 / 4.026² = 12.6 ft/s.
 *
 * @param flow Q, the flow, gpm
 * @param diameter d, the internal diameter, in
 * @returns v, the mean velocity, ft/s
 * @see definition: flow over the bore's area
 * @example
 * velocity(500, 4.026) // ≈ 12.6 ft/s
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
 * 30 ft: 0.433 × 30 = 12.99 psi.
 *
 * @param rise the height climbed, ft (negative for a drop)
 * @returns the pressure, psi (negative for a drop)
 * @see [NFPA 13] 0.433 psi per ft
 * @example
 * elevationPressure(30) // ≈ 12.99 psi
 * elevationPressure(-10) // ≈ -4.33 psi
 */
export function elevationPressure(rise: number): number {
  return PSI_PER_FT_WATER * rise;
}
