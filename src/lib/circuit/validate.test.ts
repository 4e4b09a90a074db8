/**
 * Bad circuit files: one case per error class of the spec's command-line section (plus duplicate
 * ids and bad id characters), each asserting the 1-based line, the key and the message. The rules
 * come from /work/shared/spec/circuit-format.md ("Names", "Parts and their pins", "The command line").
 */
import { describe, expect, it } from 'vitest';
import { CircuitFileError, checkCircuitText, parseCircuit } from './index';

const GOOD = `supply: 12.6
parts:
  F1: { type: fuse, amps: 10 }
  L1: { type: lamp, watts: 21 }
  G1: { type: ground }
wires:
  - B+ F1.1
  - F1.2 L1.1
  - L1.2 G1
states:
  on: {}
`;

type Case = { name: string; text: string; line: number; key: string; message: RegExp };

const cases: Case[] = [
	{
		name: 'unknown part',
		text: GOOD.replace('F1.2 L1.1', 'F1.2 X9.1'),
		line: 8,
		key: 'wires.W2',
		message: /unknown part "X9"/
	},
	{
		name: 'unknown pin',
		text: GOOD.replace('F1.2 L1.1', 'F1.3 L1.1'),
		line: 8,
		key: 'wires.W2',
		message: /unknown pin "3" on F1 .*pins are 1, 2/
	},
	{
		name: 'unknown node',
		text: GOOD.replace('L1.2 G1', 'L1.2 CHASSIS'),
		line: 9,
		key: 'wires.W3',
		message: /unknown node "CHASSIS"/
	},
	{
		name: 'unwired pin',
		text: GOOD.replace('  - F1.2 L1.1\n', '  - F1.2 G1\n'),
		line: 4,
		key: 'parts.L1',
		message: /pin L1\.1 is not wired/
	},
	{
		name: 'state naming a missing part',
		text: GOOD.replace('on: {}', 'on: { S7: closed }'),
		line: 11,
		key: 'states.on.S7',
		message: /"S7", which is not a part/
	},
	{
		name: 'state naming a setting the part lacks',
		text: GOOD.replace('on: {}', 'on: { L1: closed }'),
		line: 11,
		key: 'states.on.L1',
		message: /L1 is a lamp, which has no setting a state can change/
	},
	{
		name: 'a load with two value keys',
		text: GOOD.replace('{ type: lamp, watts: 21 }', '{ type: lamp, watts: 21, ohms: 7 }'),
		line: 4,
		key: 'parts.L1',
		message: /L1 has watts and ohms; a load takes exactly one of ohms, watts, amps/
	},
	{
		name: 'a wire size not in the table',
		text: GOOD.replace('  - F1.2 L1.1', '  - { from: F1.2, to: L1.1, gauge_mm2: 2, length_m: 1 }'),
		line: 8,
		key: 'wires.W2.gauge_mm2',
		message: /gauge_mm2 2 is not in the table; use one of 0\.5, 0\.75, 1, 1\.5, 2\.5, 4, 6/
	},
	{
		name: 'an AWG size not in the table',
		text: GOOD.replace('  - F1.2 L1.1', '  - { from: F1.2, to: L1.1, gauge_awg: 8, length_m: 1 }'),
		line: 8,
		key: 'wires.W2.gauge_awg',
		message: /gauge_awg 8 is not in the table; use one of 22, 20, 18, 16, 14, 12, 10/
	},
	{
		name: 'a size without length_m',
		text: GOOD.replace('  - F1.2 L1.1', '  - { from: F1.2, to: L1.1, gauge_mm2: 1.5 }'),
		line: 8,
		key: 'wires.W2.length_m',
		message: /has a size but no length_m/
	},
	{
		name: 'unknown key in a part',
		text: GOOD.replace('{ type: fuse, amps: 10 }', '{ type: fuse, amps: 10, colour: red }'),
		line: 3,
		key: 'parts.F1.colour',
		message: /unknown key "colour" on F1/
	},
	{
		name: 'unknown key in a wire',
		text: GOOD.replace('  - F1.2 L1.1', '  - { from: F1.2, to: L1.1, gauge: 2 }'),
		line: 8,
		key: 'wires.W2.gauge',
		message: /unknown key "gauge" on wire W2/
	},
	{
		name: 'an ideal-wire loop',
		text: GOOD.replace('  - L1.2 G1\n', '  - L1.2 G1\n  - G1 L1.2\n'),
		line: 10,
		key: 'wires.W4',
		message: /ideal wire W4 \(G1 to L1\.2\) closes a loop of ideal wires/
	},
	{
		name: 'a YAML error',
		text: GOOD.replace('  F1: { type: fuse, amps: 10 }', '  F1: { type: fuse, amps: 10'),
		line: 4,
		key: 'yaml',
		message: /fix the YAML syntax/
	},
	{
		name: 'a duplicate id across parts and wires',
		text: GOOD.replace('  - F1.2 L1.1', '  - { from: F1.2, to: L1.1, id: F1 }'),
		line: 8,
		key: 'wires.F1',
		message: /id "F1" is already used on line 3/
	},
	{
		name: 'bad id characters',
		text: GOOD.replace('  G1: { type: ground }', '  G1: { type: ground }\n  S:1: { type: splice }'),
		line: 6,
		key: 'parts.S:1',
		message: /contains one of \. , : or a space/
	},
	{
		name: 'a missing required key',
		text: GOOD.replace('{ type: fuse, amps: 10 }', '{ type: fuse }'),
		line: 3,
		key: 'parts.F1.amps',
		message: /F1 needs amps/
	},
	{
		name: 'an unknown part type',
		text: GOOD.replace('{ type: ground }', '{ type: earth }'),
		line: 5,
		key: 'parts.G1.type',
		message: /unknown part type "earth"/
	}
];

describe('bad circuit files (spec: every error with its line)', () => {
	it('the base file is good', () => {
		expect(checkCircuitText(GOOD)).toEqual([]);
	});
	for (const c of cases) {
		it(c.name, () => {
			const problems = checkCircuitText(c.text);
			const hit = problems.find((p) => p.key === c.key);
			expect(hit, JSON.stringify(problems)).toBeDefined();
			expect(hit!.line).toBe(c.line);
			expect(hit!.message).toMatch(c.message);
			expect(() => parseCircuit(c.text)).toThrow(CircuitFileError);
		});
	}
	it('lists every problem of a file in one pass, sorted by line, in the message as "line N: key: message"', () => {
		const text = GOOD.replace('{ type: fuse, amps: 10 }', '{ type: fuse, amps: 10, colour: red }').replace('L1.2 G1', 'L1.2 Q1.1');
		let err: CircuitFileError | null = null;
		try {
			parseCircuit(text);
		} catch (e) {
			err = e as CircuitFileError;
		}
		expect(err).toBeInstanceOf(CircuitFileError);
		// the wire to G1 is gone, so G1 is unwired too (line 5)
		expect(err!.problems.map((p) => p.line)).toEqual([3, 5, 9]);
		expect(err!.message.split('\n')).toEqual([
			'line 3: parts.F1.colour: unknown key "colour" on F1 (a fuse); allowed: type, amps',
			'line 5: parts.G1: ground G1 is not wired; wire it or remove it',
			'line 9: wires.W3: unknown part "Q1" in "Q1.1"; add it under parts or fix the name'
		]);
	});
	it('reads on and off as strings (YAML 1.2), so they work as state names', () => {
		const c = parseCircuit(GOOD.replace('  on: {}', '  on: {}\n  off: {}\n  yes: {}'));
		expect(c.states.map((s) => s.name)).toEqual(['on', 'off', 'yes']);
	});
	it('leaves relay 87/87a and a connector cavity wired on neither side unwired without error (spec "Names")', () => {
		const text = `supply: 12.6
parts:
  K1: { type: relay }
  C1: { type: connector, cavities: 2 }
wires:
  - B+ K1.86
  - K1.85 GND
  - B+ C1.1a
  - C1.1b K1.30
`;
		expect(checkCircuitText(text)).toEqual([]);
		const half = text.replace('  - C1.1b K1.30\n', '  - C1.1b K1.30\n  - C1.2a GND\n');
		expect(checkCircuitText(half)).toEqual([
			{ line: 4, key: 'parts.C1', message: 'pin C1.2b is not wired; a cavity is wired on both sides or neither' }
		]);
	});
	it('computes wire resistance from IEC 60228 class 5 and the HyperPhysics AWG table', () => {
		const c = parseCircuit(
			GOOD.replace('  - F1.2 L1.1', '  - { from: F1.2, to: L1.1, gauge_mm2: 0.5, length_m: 2 }').replace(
				'  - L1.2 G1',
				'  - { from: L1.2, to: G1, gauge_awg: 18, length_m: 3.048 }'
			)
		);
		// IEC 60228 class 5: 0.5 mm² is 39.0 mΩ/m, so 2 m is 0.078 Ω
		expect(c.wires[1].ohms).toBeCloseTo(0.078, 12);
		// HyperPhysics: 18 AWG is 6.385 Ω per 1000 ft; 3.048 m is exactly 10 ft, so 0.06385 Ω
		expect(c.wires[2].ohms).toBeCloseTo(0.06385, 12);
	});
});
