/**
 * Published values and the product's own modelling constants, each with its source.
 */

/** IEC 60228 class 5 (flexible) copper, maximum resistance at 20 °C, in mΩ per metre, by cross-section in mm². */
export const IEC_60228_CLASS5_MOHM_PER_M: ReadonlyMap<number, number> = new Map([
	[0.5, 39.0],
	[0.75, 26.0],
	[1, 19.5],
	[1.5, 13.3],
	[2.5, 7.98],
	[4, 4.95],
	[6, 3.3]
]);

/** HyperPhysics "Common Wire Gauges", solid copper at 20 °C, in Ω per 1000 ft, by AWG number. */
export const AWG_OHM_PER_1000FT: ReadonlyMap<number, number> = new Map([
	[22, 16.14],
	[20, 10.15],
	[18, 6.385],
	[16, 4.016],
	[14, 2.525],
	[12, 1.588],
	[10, 0.9989]
]);

/** Metres in one foot (international foot, exact). */
export const METRES_PER_FOOT = 0.3048;

/** Meter input resistance in Ω from every electrical node to GND (typical DMM DC volts input, makers' specifications). */
export const METER_OHMS = 10e6;
/** Resistance of an intact fuse, fusible link or breaker, in Ω (spec). */
export const FUSE_OHMS = 0.001;
/** Resistance of a short fault (shorted part, short to ground/power, short between wires), in Ω (product convention). */
export const SHORT_OHMS = 0.01;
/** Default added resistance of a high-resistance fault, in Ω (spec). */
export const HIGH_RESISTANCE_DEFAULT_OHMS = 1;
/** Test lamp power in W at the file's supply volts (product convention). */
export const TEST_LAMP_WATTS = 21;

/** Relay defaults (12 V plug-in automotive mini relay catalogue, worst case of each band): coil Ω, pull-in V, drop-out V. */
export const RELAY_DEFAULTS = { coil_ohms: 80, pull_in: 7.0, drop_out: 1.2 } as const;
/** Diode defaults: forward drop in V, on-resistance in Ω (on-resistance is a product convention). */
export const DIODE_DEFAULTS = { drop: 0.7, ohms: 0.1 } as const;

/** Reading class band in mV: a point within this of the battery EMF reads `supply`, of 0 V reads `ground` (inclusive). */
export const READING_BAND_MV = 200;
/** A load is `on` at or above this fraction of the current the source volts in force would drive through it alone (product convention). */
export const LOAD_ON_FRACTION = 0.8;
/** A load is `weak` at or above this fraction (and below `LOAD_ON_FRACTION`), else `off` (product convention). */
export const LOAD_WEAK_FRACTION = 0.25;
/** Smallest current, in A, that counts as carrying current for paths (0.1 mA, the amps rounding step). */
export const PATH_MIN_AMPS = 1e-4;

/** Relative pivot tolerance of the LU factorisation: a pivot below this times the column's largest entry is singular. */
export const PIVOT_REL_TOL = 1e-13;
/** Upper bound on settling steps; a guard against a configuration that never settles. */
export const MAX_SETTLE_STEPS = 10000;

/** Rounds volts to 1 mV (spec), without a negative zero. */
export function roundVolts(v: number): number {
	const r = Math.round(v * 1000) / 1000;
	return r === 0 ? 0 : r;
}
/** Rounds a current magnitude to 0.1 mA (4 decimals, spec). */
export function roundAmps(a: number): number {
	const r = Math.round(Math.abs(a) * 1e4) / 1e4;
	return r === 0 ? 0 : r;
}
/** Volts as integer millivolts, the unit every threshold is judged in. */
export function toMillivolts(v: number): number {
	return Math.round(v * 1000);
}
