/**
 * Grading of every kind: full credit, the partial-credit rules, tolerance edges just inside and just
 * outside, matched mistakes, and refused response shapes. The items are built by the engine from
 * the hand-keyed files, so the keys under test are the ones worked out by hand there.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildBank } from './bank';
import { gradeResponse, ResponseError, setScore } from './grade';
import type { BuiltItem } from './types';

const CIRCUITS = {
	'content/circuits/cooling-fan-relay.yaml': readFileSync('content/circuits/cooling-fan-relay.yaml', 'utf8'),
	'content/circuits/headlamps-shared-fuse.yaml': readFileSync('content/circuits/headlamps-shared-fuse.yaml', 'utf8')
};

function item(file: string, edit: (t: string) => string = (t) => t): BuiltItem {
	const r = buildBank({ files: { [file]: edit(readFileSync(file, 'utf8')) }, circuits: CIRCUITS, families: [] });
	expect(r.errors).toEqual([]);
	return r.items[0];
}

describe('numeric', () => {
	// OpenStax College Physics, Example 21.1: V(C) = 0.600 A x 13.0 ohm = 7.80 V; the item's tolerance is 0.05 V
	const it0 = item('content/items/hand/series-heaters-midpoint-volts.md');
	it('full credit at the key and just inside the tolerance', () => {
		expect(gradeResponse(it0, { value: 7.8 })).toMatchObject({ score: 1, correct: true });
		expect(gradeResponse(it0, { value: 7.849 })).toMatchObject({ score: 1, correct: true });
		expect(gradeResponse(it0, { value: 7.751 })).toMatchObject({ score: 1, correct: true });
	});
	it('half credit just outside the tolerance while the value stays in the key’s reading class (partial)', () => {
		const g = gradeResponse(it0, { value: 7.86 });
		expect(g).toMatchObject({ score: 0.5, correct: false });
		expect(g.feedback.off_by).toBeCloseTo(0.06, 6);
	});
	it('no credit for a value in another reading class: battery volts (supply) or about 0 V (ground)', () => {
		expect(gradeResponse(it0, { value: 12.0 }).score).toBe(0);
		expect(gradeResponse(it0, { value: 0.1 }).score).toBe(0);
	});
	it('names the mistake when the answer is a distractor: a test lamp in place of the meter', () => {
		const d = it0.distractors.find((x) => x.tag === 'meter-read-as-lamp')!;
		expect(d).toBeDefined();
		expect(gradeResponse(it0, { value: d.value as number }).feedback.mistake).toBe('meter-read-as-lamp');
	});
	it('refuses a response that is not a number', () => {
		expect(() => gradeResponse(it0, { value: '7.8' })).toThrow(ResponseError);
		expect(() => gradeResponse(it0, { value: Number.NaN })).toThrow(/a number in V/);
		expect(() => gradeResponse(it0, null)).toThrow(ResponseError);
	});
	it('a supply-class key: 0.1 V default tolerance, half credit inside the 0.2 V band', () => {
		// common practice: a high-impedance meter on a point with no current reads source voltage
		const fan = item('content/items/hand/fan-relay-open-switch-ground.md', (t) =>
			t.replace('kind: choose-one', 'kind: numeric').replace('ask: { status: K1, state: hot, fault: open:W4 }', 'ask: { volts: B, state: cold }').replace(/^stated_key: .*$/m, 'stated_key: 12.6')
		);
		expect(fan.key).toMatchObject({ kind: 'numeric', value: 12.6, tolerance: 0.1, reads: 'supply', emf: 12.6 });
		expect(gradeResponse(fan, { value: 12.5 }).score).toBe(1);
		expect(gradeResponse(fan, { value: 12.49 }).score).toBe(0.5);
		expect(gradeResponse(fan, { value: 12.4 }).score).toBe(0.5);
		expect(gradeResponse(fan, { value: 12.39 }).score).toBe(0);
	});
});

describe('choose-one', () => {
	const it0 = item('content/items/hand/fan-relay-open-switch-ground.md');
	it('1 for the key, 0 otherwise, with the mistake named', () => {
		expect(gradeResponse(it0, { choice: 'released' })).toMatchObject({ score: 1, correct: true });
		const g = gradeResponse(it0, { choice: 'energized' });
		expect(g).toMatchObject({ score: 0, correct: false });
		expect(g.feedback.mistake).toBe(it0.distractors.find((d) => d.label === 'energized')!.tag);
	});
	it('refuses an option the item does not have', () => {
		expect(() => gradeResponse(it0, { choice: 'chattering' })).toThrow(/not an option/);
	});
});

describe('choose-all', () => {
	// key worked by hand: open:FAN_FEED, open:M1, open:F2; the fourth option, open:W4, is wrong
	const it0 = item('content/items/hand/fan-relay-clicks-no-fan.md');
	it('exact set: full credit', () => {
		expect(gradeResponse(it0, { choices: ['open:F2', 'open:M1', 'open:FAN_FEED'] })).toMatchObject({ score: 1, correct: true });
	});
	it('partial credit: (right − wrong) / number right, floored at 0', () => {
		expect(gradeResponse(it0, { choices: ['open:F2', 'open:M1'] }).score).toBeCloseTo(2 / 3, 6);
		expect(gradeResponse(it0, { choices: ['open:F2', 'open:M1', 'open:FAN_FEED', 'open:W4'] }).score).toBeCloseTo(2 / 3, 6);
		expect(gradeResponse(it0, { choices: ['open:F2', 'open:W4'] }).score).toBe(0);
		expect(gradeResponse(it0, { choices: [] }).score).toBe(0);
	});
	it('a wrong pick names its mistake', () => {
		expect(gradeResponse(it0, { choices: ['open:W4'] }).feedback.mistake).toBe('explains-part-of-complaint');
	});
	it('refuses ids that are not options', () => {
		expect(() => gradeResponse(it0, { choices: ['open:W9'] })).toThrow(/not an option/);
		expect(() => gradeResponse(it0, { choices: 'open:F2' })).toThrow(/list of ids/);
	});
});

describe('select-diagram', () => {
	const it0 = item('content/items/hand/single-lamp-path.md');
	it('full credit for the path, partial for missing or extra elements', () => {
		expect(gradeResponse(it0, { elements: ['F1', 'S1', 'L1', 'G1', 'W1', 'W2', 'W3', 'W4'] }).score).toBe(1);
		expect(gradeResponse(it0, { elements: ['F1', 'S1', 'L1', 'G1', 'W1', 'W2'] }).score).toBeCloseTo(6 / 8, 6);
		expect(gradeResponse(it0, { elements: ['F1', 'S1', 'L1', 'G1', 'W1', 'W2', 'W3'] }).score).toBeCloseTo(7 / 8, 6);
		expect(gradeResponse(it0, { elements: [] }).score).toBe(0);
	});
	it('marks each element right or wrong', () => {
		expect(gradeResponse(it0, { elements: ['F1', 'W1'] }).feedback.marks).toMatchObject({ F1: true, W1: true, L1: false });
	});
	it('refuses an id that is not on the diagram', () => {
		expect(() => gradeResponse(it0, { elements: ['X9'] })).toThrow(/not a part or wire/);
	});
	it('an empty key scores 1 only for an empty answer', () => {
		expect(setScore([], []).score).toBe(1);
		expect(setScore([], ['W1']).score).toBe(0);
	});
});

describe('predict-works', () => {
	// common practice: the short blows the shared fuse, both lamps off
	const it0 = item('content/items/hand/headlamps-feed-short.md');
	it('the share of loads right', () => {
		expect(gradeResponse(it0, { loads: { L1: 'off', L2: 'off' } })).toMatchObject({ score: 1, correct: true });
		expect(gradeResponse(it0, { loads: { L1: 'off', L2: 'on' } }).score).toBe(0.5);
		expect(gradeResponse(it0, { loads: { L1: 'on', L2: 'on' } }).score).toBe(0);
	});
	it('names the mistake of forgetting the fault', () => {
		expect(gradeResponse(it0, { loads: { L1: 'on', L2: 'on' } }).feedback.mistake).toBe('fault-ignored');
	});
	it('refuses a missing load or a status that is not on, weak or off', () => {
		expect(() => gradeResponse(it0, { loads: { L1: 'off' } })).toThrow(/L2/);
		expect(() => gradeResponse(it0, { loads: { L1: 'off', L2: 'dim' } })).toThrow(/on", "weak" or "off/);
		expect(() => gradeResponse(it0, { loads: { L1: 'off', L2: 'off', L9: 'on' } })).toThrow(/not a load/);
	});
});

describe('claim-check', () => {
	// worked by hand: [false, true]
	const it0 = item('content/items/hand/fan-relay-two-statements.md');
	it('the share of statements judged right', () => {
		expect(gradeResponse(it0, { verdicts: [false, true] })).toMatchObject({ score: 1, correct: true });
		expect(gradeResponse(it0, { verdicts: [true, true] }).score).toBe(0.5);
		expect(gradeResponse(it0, { verdicts: [true, false] }).score).toBe(0);
	});
	it('refuses the wrong number of verdicts', () => {
		expect(() => gradeResponse(it0, { verdicts: [true] })).toThrow(/one per statement/);
	});
});

describe('next-test', () => {
	// worked by hand in the file: off/B and on/B leave 2, C leaves 2.5, A (all four read alike) leaves 4 of 4
	const it0 = item('content/items/hand/lamp-next-test.md');
	it('1 for the best test and for one as good', () => {
		expect(gradeResponse(it0, { state: 'off', point: 'B' })).toMatchObject({ score: 1, correct: true });
		expect(gradeResponse(it0, { state: 'on', point: 'B' })).toMatchObject({ score: 1, correct: true });
	});
	it('0.5 for a test that splits the candidates less well', () => {
		expect(gradeResponse(it0, { state: 'on', point: 'C' })).toMatchObject({ score: 0.5, correct: false });
	});
	it('0 for a test that tells nothing', () => {
		const g = gradeResponse(it0, { state: 'on', point: 'A' });
		expect(g.score).toBe(0);
		expect(g.feedback.mistake).toBe('test-tells-nothing');
	});
	it('refuses an unknown point or state', () => {
		expect(() => gradeResponse(it0, { state: 'on', point: 'Z' })).toThrow(/not a test/);
		expect(() => gradeResponse(it0, { point: 'B' })).toThrow(ResponseError);
	});
});
