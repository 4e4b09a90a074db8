import type { Circuit } from './model';
import type { SolveOptions } from './types';
/** Current path through an element (in progress). */
export function tracePath(_c: Circuit, _o: SolveOptions & { through: string }): { elements: string[] } {
	throw new Error('paths not committed yet');
}
/** Shared part of two paths (in progress). */
export function sharedPath(a: { elements: string[] }, b: { elements: string[] }, _c: Circuit): { elements: string[] } {
	return { elements: a.elements.filter((x) => b.elements.includes(x)) };
}
