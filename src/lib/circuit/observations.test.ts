/**
 * Observations text and its checks against a circuit (format: spec "The command line", diagnose).
 */
import { describe, expect, it } from 'vitest';
import { FAN } from './test-fixtures';
import { ObservationError, diagnose, parseCircuit, parseObservations } from './index';

describe('parseObservations', () => {
	it('reads states, part statuses and point readings', () => {
		expect(parseObservations('on: M1=off, A=ground; off: A=supply, K1=released')).toEqual([
			{ state: 'on', parts: { M1: 'off' }, points: { A: 'ground' } },
			{ state: 'off', parts: { K1: 'released' }, points: { A: 'supply' } }
		]);
	});
	it('ignores spaces and a trailing semicolon', () => {
		expect(parseObservations('  on :  M1 = on ;')).toEqual([{ state: 'on', parts: { M1: 'on' }, points: {} }]);
	});
	for (const [text, msg] of [
		['M1=off', /must start with a state name and a colon/],
		['on: M1', /must be NAME=VALUE/],
		['on: M1=off, M1=on', /M1 is observed twice/],
		['on:', /has no observations/],
		['', /no observations given/]
	] as const)
		it(`rejects "${text}"`, () => {
			expect(() => parseObservations(text)).toThrow(ObservationError);
			expect(() => parseObservations(text)).toThrow(msg);
		});
});

describe('diagnose checks observations against the circuit', () => {
	const c = parseCircuit(FAN);
	for (const [text, msg] of [
		['run: M1=off', /unknown state "run"; this circuit's states are off, on/],
		['on: M9=off', /unknown part "M9"/],
		['on: Z=ground', /unknown point "Z"/],
		['on: M1=spinning', /M1 \(a motor\) has no status "spinning"; use one of on, weak, off/],
		['on: G1=ok', /G1 is a ground, which has no status to observe/],
		['on: A=lit', /point A reads one of supply, ground, partial, floating/]
	] as const)
		it(`rejects "${text}"`, () => {
			expect(() => diagnose(c, parseObservations(text))).toThrow(msg);
		});
});
