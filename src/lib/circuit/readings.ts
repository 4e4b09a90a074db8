/**
 * Two-lead meter readings from a solve result (spec "What the engine answers": a reading between two
 * points is the difference of their volts).
 */
import { SolveOptionError } from './errors';
import { roundVolts } from './tables';
import type { SolveResult } from './types';

/**
 * The volts a meter shows with its red lead on `red` and its black lead on `black`: V(red) − V(black)
 * from the result's volts (each already rounded to 1 mV), rounded to 1 mV. Each lead names a labelled
 * point or a node (`B+`, `GND`, `PART.PIN`, a splice or ground id).
 * @throws SolveOptionError when a lead names neither a point nor a node of the result.
 */
export function meterReading(result: SolveResult, red: string, black: string): number {
	return roundVolts(voltsAt(result, red, 'red') - voltsAt(result, black, 'black'));
}

function voltsAt(r: SolveResult, where: string, lead: string): number {
	const p = r.points[where];
	if (p) return p.volts;
	const v = r.nodes[where];
	if (v === undefined) throw new SolveOptionError(lead, `the ${lead} lead's "${where}" is not a labelled point or node of this circuit`);
	return v;
}
