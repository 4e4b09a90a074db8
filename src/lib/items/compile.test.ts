/**
 * Hand-keyed items: for every kind, an item in content/items/hand whose stated key was worked out by
 * hand (the derivation is in the file's front matter) and is accepted by the build; and the same item
 * with a wrong stated key, which the build refuses with an error that shows both values. Plus the
 * reader's messages for broken item files.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildBank } from './bank';
import { KINDS } from './types';

const CIRCUITS = {
	'content/circuits/cooling-fan-relay.yaml': readFileSync('content/circuits/cooling-fan-relay.yaml', 'utf8'),
	'content/circuits/headlamps-shared-fuse.yaml': readFileSync('content/circuits/headlamps-shared-fuse.yaml', 'utf8')
};

/** The hand-keyed item of each kind, with its file, the key the build must accept, and a wrong one. */
const HAND = [
	{
		kind: 'numeric',
		file: 'content/items/hand/series-heaters-midpoint-volts.md',
		// OpenStax College Physics, Example 21.1: 12.0 V across 1.00 + 6.00 + 13.0 ohm gives 0.600 A; H3 drops 7.80 V
		right: '7.8',
		wrong: '3.6',
		shows: ['3.6', '7.8']
	},
	{
		kind: 'choose-one',
		file: 'content/items/hand/fan-relay-open-switch-ground.md',
		// common practice: no coil current, no coil volts, the relay stays released
		right: 'released',
		wrong: 'energized',
		shows: ['energized', 'released']
	},
	{
		kind: 'choose-all',
		file: 'content/items/hand/fan-relay-clicks-no-fan.md',
		// common practice: a relay that pulls in has a whole coil circuit; the break is on the load side
		right: '[open:FAN_FEED, open:M1, open:F2]',
		wrong: '[open:FAN_FEED, open:W4]',
		shows: ['open:W4', 'open:FAN_FEED, open:M1, open:F2']
	},
	{
		kind: 'select-diagram',
		file: 'content/items/hand/single-lamp-path.md',
		// Kirchhoff's current law: a single series loop carries one current through every element
		right: '[F1, S1, L1, G1, W1, W2, W3, W4]',
		wrong: '[S1, L1, W3]',
		shows: ['"S1","L1","W3"', 'F1, S1, L1, G1, W1, W2, W3, W4']
	},
	{
		kind: 'predict-works',
		file: 'content/items/hand/headlamps-feed-short.md',
		// common practice: a short to ground between the fuse and the load blows the fuse and takes out everything on it
		right: '{ L1: off, L2: off }',
		wrong: '{ L1: off, L2: on }',
		shows: ['"L2":"on"', '"L2":"off"']
	},
	{
		kind: 'claim-check',
		file: 'content/items/hand/fan-relay-two-statements.md',
		// common practice: released relay, 87 reads 0 V at the load; a closed ground-side switch reads about 0 V
		right: '[false, true]',
		wrong: '[true, true]',
		shows: ['[true,true]', '[false, true]']
	},
	{
		kind: 'next-test',
		file: 'content/items/hand/lamp-next-test.md',
		// worked by hand in the file: sum n^2 / N is 2 at off/B and on/B, 2.5 at C, 4 at A; ties go to the first state
		right: 'off/B',
		wrong: 'on/A',
		shows: ['on/A', 'off/B']
	}
] as const;

function withStatedKey(text: string, key: string): string {
	return text.replace(/^stated_key: .*$/m, `stated_key: ${key}`);
}

function build(file: string, text: string) {
	return buildBank({ files: { [file]: text }, circuits: CIRCUITS, families: [] });
}

describe('hand-keyed items', () => {
	it('cover every kind', () => {
		expect(HAND.map((h) => h.kind).sort()).toEqual([...KINDS].sort());
	});

	for (const h of HAND) {
		const text = readFileSync(h.file, 'utf8');
		it(`${h.kind}: the key worked out by hand (${h.right}) is the engine's`, () => {
			expect(text).toMatch(/^# Worked by hand/m);
			const r = build(h.file, withStatedKey(text, h.right));
			expect(r.errors).toEqual([]);
			expect(r.items).toHaveLength(1);
			expect(r.items[0].kind).toBe(h.kind);
		});
		it(`${h.kind}: a wrong stated key (${h.wrong}) is refused, showing both values`, () => {
			const r = build(h.file, withStatedKey(text, h.wrong));
			expect(r.items).toHaveLength(0);
			expect(r.errors).toHaveLength(1);
			const e = r.errors[0];
			expect(e.file).toBe(h.file);
			expect(e.line).toBe(text.split('\n').findIndex((l) => l.startsWith('stated_key:')) + 1);
			for (const s of h.shows) expect(e.message).toContain(s);
			expect(e.fix).toMatch(/stated key/);
		});
	}

	it('the numeric hand item keys 7.80 V with 0.600 A in the loop (OpenStax College Physics, Example 21.1)', () => {
		const r = build(HAND[0].file, readFileSync(HAND[0].file, 'utf8'));
		const it0 = r.items[0];
		expect(it0.key.kind === 'numeric' && it0.key.value).toBeCloseTo(7.8, 2);
		const amps = buildBank({
			files: { 'x.md': readFileSync(HAND[0].file, 'utf8').replace('ask: { volts: C, state: on }', 'ask: { amps: H2, state: on }').replace(/^stated_key: .*$/m, 'stated_key: 0.6') },
			circuits: {},
			families: []
		});
		expect(amps.errors).toEqual([]);
		expect(amps.items[0].key.kind === 'numeric' && amps.items[0].key.value).toBeCloseTo(0.6, 3);
	});
});

describe('broken item files get a message naming the line and what to do', () => {
	const base = readFileSync('content/items/hand/fan-relay-open-switch-ground.md', 'utf8');
	const cases: { name: string; text: string; line: number | null; message: RegExp }[] = [
		{ name: 'no front matter', text: 'Just a stem.', line: 1, message: /front matter/ },
		{ name: 'an unknown key', text: base.replace('kind: choose-one', 'kind: choose-one\ncolour: red'), line: 6, message: /unknown front matter key "colour"/ },
		{ name: 'an unknown kind', text: base.replace('kind: choose-one', 'kind: essay'), line: 5, message: /unknown kind "essay"/ },
		{ name: 'a missing circuit file', text: base.replace('cooling-fan-relay.yaml', 'nowhere.yaml'), line: 6, message: /circuit file "content\/circuits\/nowhere.yaml" was not found/ },
		{ name: 'an unknown state', text: base.replace('state: hot', 'state: warm'), line: 7, message: /state "warm" is not a state/ },
		{ name: 'an unknown part', text: base.replace('status: K1', 'status: K9'), line: 7, message: /part "K9" is not in the circuit/ },
		{ name: 'a fault that does not fit', text: base.replace('open:W4', 'open:W99'), line: 7, message: /W99/ },
		{ name: 'a skill of another area', text: base.replace('skill: relay-operation', 'skill: next-test'), line: 4, message: /belongs to area diagnostic-strategy/ },
		{ name: 'a kind that cannot ask this', text: base.replace('kind: choose-one', 'kind: numeric'), line: 5, message: /kind numeric cannot ask "status"/ },
		{ name: 'a YAML error', text: base.replace('ask: { status: K1', 'ask: { status: [K1'), line: null, message: /YAML/ }
	];
	for (const c of cases)
		it(c.name, () => {
			const r = build('content/items/x.md', c.text);
			expect(r.items).toHaveLength(0);
			expect(r.errors).toHaveLength(1);
			if (c.line !== null) expect(r.errors[0].line).toBe(c.line);
			expect(r.errors[0].message).toMatch(c.message);
			expect(r.errors[0].fix.length).toBeGreaterThan(5);
		});

	it('an inline circuit error points at the line inside the item file', () => {
		const text = readFileSync('content/items/hand/single-lamp-path.md', 'utf8').replace('L1: { type: lamp, watts: 21 }', 'L1: { type: lamp, watts: 21, ohms: 3 }');
		const r = build('content/items/y.md', text);
		expect(r.errors.length).toBeGreaterThan(0);
		expect(r.errors[0].file).toBe('content/items/y.md');
		expect(r.errors[0].line).toBe(text.split('\n').findIndex((l) => l.includes('ohms: 3')) + 1);
	});

	it('two items with one id are refused', () => {
		const r = buildBank({ files: { 'a.md': base, 'b.md': base }, circuits: CIRCUITS, families: [] });
		expect(r.items).toHaveLength(1);
		expect(r.errors[0].message).toMatch(/used by another item/);
	});
});
