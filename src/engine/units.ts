/**
 * Every US customary ↔ SI constant of Headroom, and nothing else holds one.
 *
 * The engine works in US customary units (gpm, psi, in, ft, ft², gpm/ft², K in gpm/psi^0.5). The cell-function layer
 * converts SI arguments to US on the way in and US results to SI on the way out with `toUS` / `fromUS`.
 * Each constant is exact by definition of the units, or derived from exact ones; the test suite confirms each one
 * against mathjs's own unit definitions.
 */

/**
 * US liquid gallon in litres: 1 gpm = 3.785411784 L/min.
 * @see definition: 231 in³ exactly
 */
export const L_PER_GAL = 3.785411784;
/**
 * Pound-force per square inch in bar.
 * @see definition: 6894.757293168 Pa (exact from lbf and in) / 100000 Pa
 * @example
 * BAR_PER_PSI // ≈ 0.0689476
 */
// eslint-disable-next-line no-loss-of-precision -- the 17th digit is the exact value's; it parses to the same double.
export const BAR_PER_PSI = 0.06894757293168361;
/**
 * Inch in millimetres.
 * @see definition: exact
 */
export const MM_PER_IN = 25.4;
/**
 * Foot in metres.
 * @see definition: exact
 */
export const M_PER_FT = 0.3048;
/**
 * Square foot in square metres.
 * @see definition: exact, 0.3048²
 * @example
 * M2_PER_FT2 // ≈ 0.09290304
 */
export const M2_PER_FT2 = M_PER_FT * M_PER_FT;
/**
 * 1 gpm/ft² in mm/min (= L/min per m²): 3.785411784 / 0.09290304 ≈ 40.746.
 * @see definition: derived from the exact constants above
 * @example
 * MMMIN_PER_GPMFT2 // ≈ 40.746
 */
export const MMMIN_PER_GPMFT2 = L_PER_GAL / M2_PER_FT2;
/**
 * K-factor: 1 gpm/psi^0.5 in L/min/bar^0.5: 3.785411784 / √0.0689476 ≈ 14.416.
 * @see definition: derived from the exact constants above; [NFPA 13] writes K_SI ≈ 14.4 K_US
 * @example
 * KSI_PER_KUS // ≈ 14.416
 */
export const KSI_PER_KUS = L_PER_GAL / Math.sqrt(BAR_PER_PSI);
/**
 * Friction rate: 1 psi/ft in bar/m: 0.0689476 / 0.3048 ≈ 0.226206.
 * @see definition: derived from the exact constants above
 * @example
 * BARM_PER_PSIFT // ≈ 0.226206
 */
export const BARM_PER_PSIFT = BAR_PER_PSI / M_PER_FT;
/**
 * Pressure of a one-foot column of water, psi.
 * @see [NFPA 13] 0.433 psi per ft
 */
export const PSI_PER_FT_WATER = 0.433;

/** The quantities that cross the cell boundary, with their US and SI unit names (for messages and labels). */
export const QUANTITIES = {
  flow: { us: "gpm", si: "L/min", factor: L_PER_GAL },
  pressure: { us: "psi", si: "bar", factor: BAR_PER_PSI },
  diameter: { us: "in", si: "mm", factor: MM_PER_IN },
  length: { us: "ft", si: "m", factor: M_PER_FT },
  area: { us: "ft²", si: "m²", factor: M2_PER_FT2 },
  density: { us: "gpm/ft²", si: "mm/min", factor: MMMIN_PER_GPMFT2 },
  kfactor: { us: "gpm/psi^0.5", si: "L/min/bar^0.5", factor: KSI_PER_KUS },
  frictionRate: { us: "psi/ft", si: "bar/m", factor: BARM_PER_PSIFT },
  velocity: { us: "ft/s", si: "m/s", factor: M_PER_FT },
} as const;

export type Quantity = keyof typeof QUANTITIES;
export type UnitSystem = "US" | "SI";

// Both conversions add 0, which turns -0 into +0 and leaves every other value as it is: a -0 argument, or a tiny
// negative that underflows in the conversion, must not reach a cell as -0.

/**
 * Convert a value of a quantity given in a unit system to US customary (never −0).
 *
 *   US value = value / factor (SI),   value (US)
 *
 * 1892.7 L/min: 1892.7 / 3.785411784 = 500.0 gpm.
 *
 * @param quantity what it measures: "flow", "pressure", "diameter", "length", ...
 * @param value the value, in the quantity's unit of `units`
 * @param units the unit system it is given in, "US" or "SI"
 * @returns the value in the quantity's US unit
 * @see definition: the constants above
 * @example
 * toUS("flow", 1892.7, "SI") // ≈ 500.0 gpm
 * toUS("pressure", 7, "US") // → 7 psi
 */
export function toUS(quantity: Quantity, value: number, units: UnitSystem): number {
  return (units === "SI" ? value / QUANTITIES[quantity].factor : value) + 0;
}

/**
 * Convert a US customary value of a quantity to a unit system (never −0).
 *
 *   value = US value × factor (SI),   US value (US)
 *
 * 100 psi: 100 × 0.0689476 = 6.89476 bar.
 *
 * @param quantity what it measures: "flow", "pressure", "diameter", "length", ...
 * @param value the value, in the quantity's US unit
 * @param units the unit system wanted, "US" or "SI"
 * @returns the value in the quantity's unit of `units`
 * @see definition: the constants above
 * @example
 * fromUS("pressure", 100, "SI") // ≈ 6.89476 bar
 * fromUS("diameter", 4.026, "SI") // ≈ 102.26 mm
 */
export function fromUS(quantity: Quantity, value: number, units: UnitSystem): number {
  return (units === "SI" ? value * QUANTITIES[quantity].factor : value) + 0;
}

/**
 * The unit name of a quantity in a unit system.
 *
 * @param quantity what it measures: "flow", "pressure", "diameter", "length", ...
 * @param units the unit system, "US" or "SI"
 * @returns the unit's name, as messages and labels write it
 * @see definition: the unit names of QUANTITIES
 * @example
 * unitName("pressure", "SI") // → "bar"
 * unitName("density", "US") // → "gpm/ft²"
 */
export function unitName(quantity: Quantity, units: UnitSystem): string {
  return units === "SI" ? QUANTITIES[quantity].si : QUANTITIES[quantity].us;
}
