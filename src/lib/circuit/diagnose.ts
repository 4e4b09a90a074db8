import type { Circuit } from './model';
import type { Diagnosis, Observation } from './types';
/** Diagnosis (in progress). */
export function diagnose(_c: Circuit, _o: Observation[]): Diagnosis {
	throw new Error('diagnosis not committed yet');
}
