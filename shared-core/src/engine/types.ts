/**
 * Shared engine types. All quantities are SI: metres, hertz, ohms, nepers per metre.
 */

/** A note that a model was used outside the input range its source publishes. */
export interface ValidityNote {
  /** Model that raised it, e.g. "Hammerstad–Jensen 1980". */
  model: string;
  /** Parameter that is out of range, e.g. "w/h". */
  parameter: string;
  value: number;
  min?: number;
  max?: number;
  message: string;
}

/** What a transmission line looks like to a wave at one frequency. */
export interface LineAtFrequency {
  /** Characteristic impedance (real part; the line is treated as low-loss), Ω. */
  z0: number;
  /** Effective relative permittivity at this frequency. */
  epsEff: number;
  /** Attenuation constant, Np/m (0 for a lossless line). */
  alpha: number;
}

/**
 * A line as a pure function of frequency. Every line model (ideal, coax, microstrip, …)
 * is adapted to this shape so stubs, resonances and bands need not know the geometry.
 */
export type LineModel = (frequencyHz: number) => LineAtFrequency;
