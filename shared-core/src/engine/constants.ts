/**
 * Physical constants in SI units.
 *
 * Source: CODATA 2018 recommended values (Tiesinga et al., Rev. Mod. Phys. 93, 025010, 2021).
 * c0 is exact by definition of the metre; μ0 and ε0 are measured since the 2019 SI redefinition.
 */

/** Speed of light in vacuum, m/s (exact). */
export const c0 = 299_792_458;

/** Vacuum magnetic permeability μ0, H/m (CODATA 2018: 1.25663706212(19) × 10⁻⁶). */
export const mu0 = 1.25663706212e-6;

/** Vacuum electric permittivity ε0, F/m (CODATA 2018: 8.8541878128(13) × 10⁻¹²). */
export const eps0 = 8.8541878128e-12;

/** Impedance of free space η0 = μ0·c0, Ω (≈ 376.730 Ω). */
export const eta0 = mu0 * c0;

/**
 * Conductivity of annealed copper, S/m: 5.8 × 10⁷ S/m is 100 % IACS
 * (International Annealed Copper Standard, IEC 28:1925, defined 1913 as 1/58 Ω·mm²/m at 20 °C).
 */
export const sigmaCopperAnnealed = 5.8e7;

/**
 * Copper foil thickness per ounce of weight per square foot: 1 oz/ft² ≈ 34.06 µm
 * (28.3495 g spread over 0.09290 m² at a density of 8.96 g/cm³; foil data sheets usually quote
 * about 35 µm for 1 oz, from memory).
 */
export const copperThicknessPerOz = 0.0283495 / (0.09290304 * 8960);
