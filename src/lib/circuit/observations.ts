import type { Observation } from './types';
/** Observations (in progress). */
export function parseObservations(_t: string): Observation[] {
	throw new Error('observations not committed yet');
}
