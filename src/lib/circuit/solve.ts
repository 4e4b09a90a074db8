import type { Circuit } from './model';
import type { DeadShortResult, ElementCurrent, LinearNetwork, SolveOptions, SolveResult } from './types';
const notYet = (): never => {
	throw new Error('solver not committed yet');
};
/** Solves a circuit (in progress). */
export function solveCircuit(_c: Circuit, _o?: SolveOptions): SolveResult | DeadShortResult {
	return notYet();
}
/** Element-level detail of one solve (in progress). */
export function solveDetailed(_c: Circuit, _o?: SolveOptions): { result: SolveResult | DeadShortResult; volts: Record<string, number>; elements: ElementCurrent[] } {
	return notYet();
}
/** The settled linear network (in progress). */
export function settledNetwork(_c: Circuit, _o?: SolveOptions): LinearNetwork {
	return notYet();
}
