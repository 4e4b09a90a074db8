/**
 * Observations for diagnosis, written `STATE: PART=STATUS, POINT=READS; STATE: ...`.
 */
import { ObservationError } from './errors';
import type { Observation, Reads } from './types';

const READS: readonly string[] = ['supply', 'ground', 'partial', 'floating'];

/**
 * Reads observations. A value that is a reading class (supply, ground, partial, floating) is a
 * point's reading; any other value is a part's status. States, parts and points are checked
 * against a circuit by `diagnose`.
 * @throws ObservationError naming the piece that cannot be read.
 */
export function parseObservations(text: string): Observation[] {
	const out: Observation[] = [];
	for (const chunk of text.split(';')) {
		const t = chunk.trim();
		if (!t) continue;
		const colon = t.indexOf(':');
		if (colon <= 0) throw new ObservationError(`"${t}" must start with a state name and a colon, e.g. "on: M1=off, A=supply"`);
		const state = t.slice(0, colon).trim();
		const obs: Observation = { state, parts: {}, points: {} };
		const body = t.slice(colon + 1).trim();
		if (!body) throw new ObservationError(`state ${state} has no observations; write NAME=VALUE pairs after the colon`);
		for (const item of body.split(',')) {
			const it = item.trim();
			const eq = it.indexOf('=');
			const k = eq > 0 ? it.slice(0, eq).trim() : '';
			const v = eq > 0 ? it.slice(eq + 1).trim() : '';
			if (!k || !v || v.includes('='))
				throw new ObservationError(`"${it}" in state ${state} must be NAME=VALUE, e.g. M1=off or A=supply`);
			if (k in obs.parts || k in obs.points) throw new ObservationError(`${k} is observed twice in state ${state}`);
			if (READS.includes(v)) obs.points[k] = v as Reads;
			else obs.parts[k] = v;
		}
		out.push(obs);
	}
	if (out.length === 0) throw new ObservationError('no observations given; write "STATE: PART=STATUS, POINT=READS"');
	return out;
}
