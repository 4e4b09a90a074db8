/**
 * Faults: text form, the standard list order and how each fault changes the circuit, checked
 * against the rules of /work/shared/spec/circuit-format.md ("Faults").
 */
import { describe, expect, it } from 'vitest';
import { FAN } from './test-fixtures';
import { FaultError, applyFault, formatFault, parseCircuit, parseFault, solveDetailed, standardFaults } from './index';

describe('parseFault and formatFault', () => {
	it('reads KIND:TARGET[:OHMS] as the spec writes it', () => {
		expect(parseFault('open:W3')).toEqual({ kind: 'open', target: 'W3' });
		expect(parseFault('high-resistance:G2:2.5')).toEqual({ kind: 'high-resistance', target: 'G2', ohms: 2.5 });
		expect(parseFault('short-between:W3,W7')).toEqual({ kind: 'short-between', target: 'W3,W7' });
		expect(parseFault('open:C1.3')).toEqual({ kind: 'open', target: 'C1.3' });
	});
	it('writes a candidate without its ohms', () => {
		expect(formatFault({ kind: 'high-resistance', target: 'W3', ohms: 1 })).toBe('high-resistance:W3');
	});
	for (const [text, msg] of [
		['W3', /must be KIND:TARGET/],
		['melted:W3', /unknown fault kind "melted"/],
		['open:W3:2', /only high-resistance takes ohms/],
		['high-resistance:W3:-1', /must be a number above 0/],
		['short-between:W3', /two different wires/],
		['open:W3,W4', /takes one target/]
	] as const)
		it(`rejects "${text}" with a FaultError`, () => {
			expect(() => parseFault(text)).toThrow(FaultError);
			expect(() => parseFault(text)).toThrow(msg);
		});
});

describe('standardFaults', () => {
	it('lists the spec example in the spec order: wires, then parts in file order', () => {
		const c = parseCircuit(FAN);
		const wires = ['W1', 'W2', 'W3', 'W4', 'W5', 'W6', 'FAN_FEED', 'W8'].flatMap((w) => [`open:${w}`, `short-to-ground:${w}`, `high-resistance:${w}`]);
		const parts = [
			'open:F1',
			'open:F2',
			'open:K1.coil',
			'open:K1.87',
			'open:K1.87a',
			'shorted:K1.coil',
			'stuck-closed:K1',
			'open:S1',
			'stuck-closed:S1',
			'open:M1',
			'shorted:M1',
			'open:G1',
			'open:G2'
		];
		expect(standardFaults(c).map(formatFault)).toEqual([...wires, ...parts]);
		expect(standardFaults(c).find((f) => f.kind === 'high-resistance')!.ohms).toBe(1);
	});
	it('gives a connector open then high-resistance on each cavity in turn, and a resistor open and shorted', () => {
		const c = parseCircuit(`supply: 12
parts:
  C1: { type: connector, cavities: 2 }
  R1: { type: resistor, ohms: 10 }
wires:
  - B+ C1.1a
  - C1.1b R1.1
  - R1.2 C1.2a
  - C1.2b GND
`);
		expect(standardFaults(c).slice(12).map(formatFault)).toEqual([
			'open:C1.1',
			'high-resistance:C1.1',
			'open:C1.2',
			'high-resistance:C1.2',
			'open:R1',
			'shorted:R1'
		]);
	});
});

describe('applyFault', () => {
	const c = parseCircuit(FAN);
	it('is pure: the circuit given is unchanged', () => {
		const before = JSON.stringify(c);
		const f = applyFault(c, 'short-to-ground:FAN_FEED');
		expect(JSON.stringify(c)).toBe(before);
		expect(f).not.toBe(c);
		expect(f.fault).toBe('short-to-ground:FAN_FEED');
	});
	it('splits a faulted wire at its midpoint: each half has half its IEC 60228 resistance, the short is 0.01 ohm to GND', () => {
		const d = solveDetailed(c, { state: 'off', fault: 'short-to-ground:FAN_FEED' });
		// IEC 60228 class 5, 2.5 mm²: 7.98 mΩ/m; 1.5 m is 11.97 mΩ, so each half is 5.985 mΩ
		const h1 = d.elements.find((e) => e.id === 'FAN_FEED#1')!;
		const h2 = d.elements.find((e) => e.id === 'FAN_FEED#2')!;
		expect(h1).toMatchObject({ from: 'K1.87', to: 'FAN_FEED#mid', kind: 'wire' });
		expect(h2).toMatchObject({ from: 'FAN_FEED#mid', to: 'M1.1', kind: 'wire' });
		expect(h1.ohms).toBeCloseTo(0.005985, 12);
		expect(h2.ohms).toBeCloseTo(0.005985, 12);
		const fault = d.elements.find((e) => e.kind === 'fault')!;
		expect(fault).toMatchObject({ from: 'FAN_FEED#mid', to: 'GND', ohms: 0.01 });
	});
	it('puts a high resistance in series between the two halves', () => {
		const d = solveDetailed(c, { state: 'on', fault: 'high-resistance:W8:2.5' });
		const fault = d.elements.find((e) => e.kind === 'fault')!;
		expect(fault).toMatchObject({ from: 'W8#mid1', to: 'W8#mid2', ohms: 2.5 });
		// all of the motor current runs through it (series): M1 is 0.9 Ω (12.6 V / 14 A)
		const m1 = d.elements.find((e) => e.id === 'M1')!;
		// less the 10 MΩ meter currents of the nodes between (about 1 µA each)
		expect(Math.abs(fault.amps - m1.amps)).toBeLessThan(1e-5);
	});
	for (const [fault, msg] of [
		['open:W99', /unknown fault target "W99"/],
		['shorted:W3', /shorted applies to a load, a resistor or a relay coil/],
		['stuck-closed:M1', /stuck-closed applies to a single-throw switch or a relay/],
		['short-to-ground:M1', /needs a wire/],
		['open:K1', /K1\.coil, K1\.87 or K1\.87a/],
		['high-resistance:F1', /applies to a wire, a ground or a connector cavity/]
	] as const)
		it(`rejects ${fault} for this circuit`, () => {
			expect(() => applyFault(c, fault)).toThrow(FaultError);
			expect(() => applyFault(c, fault)).toThrow(msg);
		});
});
