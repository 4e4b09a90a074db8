/**
 * What a circuit family is: a seeded generator of circuit variants (circuit text in the spec's
 * format plus what matters about it), from which the question forms in `forms.ts` make items.
 */
import type { AreaId } from '../blueprint';
import type { Rng } from '../rng';

/** The skills a family's own-area items use, by question form. Each must be a skill of the family's area. */
export type FamilySkills = { reading: string; status: string; current: string; drop: string; works: string; claims: string };

/** One variant of a family: a circuit and what the question forms need to know about it. */
export type FamilyVariant = {
	/** The parameters drawn (for the record; the id hashes the circuit text and the ask). */
	params: Record<string, string | number | boolean>;
	/** Circuit text in the spec's format. */
	circuit: string;
	/** A short markdown title of the circuit, used at the start of each stem. */
	title: string;
	/** Each state's name in words, e.g. `{ on: 'the pump switch closed' }`. */
	states: Record<string, string>;
	/** The state where the main load should work, and one where it should not (or null). */
	work: string;
	rest: string | null;
	/** The loads to predict, the main load first. */
	loads: string[];
	/** Faults worth asking about (engine text, e.g. `open:W7`, `high-resistance:G2:1.5`). */
	faults: string[];
	/** Two elements whose paths share something (for the shared-path form), or null. */
	shared: [string, string] | null;
	/** A voltage drop worth measuring: V(from) − V(to), in a state with an optional fault. */
	drop: { from: string; to: string; state: string; fault: string | null; words: string } | null;
	/** What a complaint observes: part statuses and point readings (default: the main load and every relay). */
	watch?: string[];
	/** The part whose current the current form asks (default: the main load). */
	currentPart?: string;
	tags?: string[];
};

/** A circuit family: `variant` must be deterministic in the rng and the index. */
export type Family = {
	id: string;
	title: string;
	area: AreaId;
	skills: FamilySkills;
	/** How many variants this family makes for each unit of `variantsPerFamily` (1 by default). */
	weight?: number;
	variant(rng: Rng, index: number): FamilyVariant;
};

/** Supply volts a healthy battery shows at rest, from fully charged down to about 75 % (reference table). */
export const REST_VOLTS = [12.2, 12.3, 12.4, 12.45, 12.5, 12.6, 12.65, 12.7, 12.8];
/** ISO 8820-3 blade fuse ratings in A. */
export const FUSE_AMPS = [5, 7.5, 10, 15, 20, 25, 30];
/** IEC 60757 colour codes for feeds, switched feeds and grounds. */
export const FEED_COLORS = ['RD', 'RD/WH', 'RD/BK', 'RD/YE', 'RD/GN'];
export const SWITCHED_COLORS = ['GN', 'GN/WH', 'BU', 'BU/WH', 'VT', 'YE', 'YE/BK', 'WH/RD', 'GY'];
export const GROUND_COLORS = ['BK', 'BN', 'BK/WH', 'BN/WH'];

/** The smallest listed fuse above `amps` × `margin`. */
export function fuseFor(amps: number, margin = 1.25): number {
	return FUSE_AMPS.find((f) => f >= amps * margin) ?? 30;
}

/** Formats a number for YAML without float noise. */
export function num(x: number): string {
	return String(Math.round(x * 1e6) / 1e6);
}
