/**
 * The outside reference values of /work/shared/reference-values.md, each written as a circuit file and
 * checked, with its source beside the check. Rules of the trade with no single published source are
 * marked `common practice`.
 *
 * The engine models an ideal battery with optional `ohms` in series, and a 10 Mohm meter on every node.
 * Textbook answers given to 3 significant figures are checked to that precision (half a unit in the
 * last given digit), and each check says so.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parse } from 'yaml';
import {
	checkCircuitText,
	parseCircuit,
	solveCircuit,
	solveDetailed,
	standardFaults,
	formatFault,
	type SolveOptions,
	type SolveResult
} from './index';

/** Half a unit in the last digit of a value given to that many decimals. */
const halfUnit = (decimals: number) => 0.5 * 10 ** -decimals;
/** Engine rounding of reported values (spec): volts to 1 mV, amps to 0.1 mA. */
const ROUNDING_V = 0.0005;
const ROUNDING_A = 0.00005;

function solved(text: string, o: SolveOptions = {}): SolveResult {
	const res = solveCircuit(parseCircuit(text), o);
	if ('error' in res) throw new Error(`unexpected dead short: ${res.elements.join(', ')}`);
	return res;
}
function within(actual: number, expected: number, tol: number, what: string) {
	expect(Math.abs(actual - expected), `${what}: got ${actual}, expected ${expected} ± ${tol}`).toBeLessThanOrEqual(tol + 1e-12);
}
function golden(file: string): string {
	return (parse(readFileSync(fileURLToPath(new URL(`./golden/${file}`, import.meta.url)), 'utf8')) as { circuit: string }).circuit;
}

describe('OpenStax College Physics, Example 21.1 (resistors in series)', () => {
	const text = `
supply: 12.0
parts:
  R1: { type: resistor, ohms: 1.00 }
  R2: { type: resistor, ohms: 6.00 }
  R3: { type: resistor, ohms: 13.0 }
wires:
  - B+ R1.1
  - R1.2 R2.1
  - R2.2 R3.1
  - R3.2 GND
`;
	it('20.0 ohm, 0.600 A, drops 0.600 / 3.60 / 7.80 V (3 significant figures)', () => {
		const r = solved(text);
		const n = r.nodes;
		within(r.parts.R1.amps, 0.6, halfUnit(3), 'OpenStax Ex. 21.1 current 0.600 A');
		within(12.0 / r.parts.R1.amps, 20.0, halfUnit(1), 'OpenStax Ex. 21.1 total 20.0 ohm');
		within(n['R1.1'] - n['R1.2'], 0.6, halfUnit(3), 'OpenStax Ex. 21.1 drop on 1.00 ohm, 0.600 V');
		within(n['R2.1'] - n['R2.2'], 3.6, halfUnit(2), 'OpenStax Ex. 21.1 drop on 6.00 ohm, 3.60 V');
		within(n['R3.1'] - n['R3.2'], 7.8, halfUnit(2), 'OpenStax Ex. 21.1 drop on 13.0 ohm, 7.80 V');
	});
});

describe('OpenStax College Physics, Example 21.2 (resistors in parallel)', () => {
	const text = `
supply: 12.0
parts:
  R1: { type: resistor, ohms: 1.00 }
  R2: { type: resistor, ohms: 6.00 }
  R3: { type: resistor, ohms: 13.0 }
wires:
  - B+ R1.1
  - B+ R2.1
  - B+ R3.1
  - R1.2 GND
  - R2.2 GND
  - R3.2 GND
`;
	it('branches 12.0 / 2.00 / 0.923 A, total 14.92 A, 0.804 ohm', () => {
		const r = solved(text);
		within(r.parts.R1.amps, 12.0, halfUnit(1), 'OpenStax Ex. 21.2 branch 12.0 A');
		within(r.parts.R2.amps, 2.0, halfUnit(2), 'OpenStax Ex. 21.2 branch 2.00 A');
		within(r.parts.R3.amps, 0.923, halfUnit(3), 'OpenStax Ex. 21.2 branch 0.923 A');
		const total = r.parts.R1.amps + r.parts.R2.amps + r.parts.R3.amps;
		within(total, 14.92, halfUnit(2), 'OpenStax Ex. 21.2 total 14.92 A');
		within(12.0 / total, 0.804, halfUnit(3), 'OpenStax Ex. 21.2 equivalent 0.804 ohm');
	});
});

describe('OpenStax College Physics, Example 21.4 (battery with internal resistance)', () => {
	const text = (r: number) => `
supply: { volts: 12.0, ohms: ${r} }
parts:
  RL: { type: resistor, ohms: 10.0 }
wires:
  - B+ RL.1
  - RL.2 GND
states:
  light: { RL: { ohms: 10.0 } }
  heavy: { RL: { ohms: 0.500 } }
`;
	it('r = 0.100 ohm, 10.0 ohm load: 1.188 A at 11.9 V', () => {
		const r = solved(text(0.1), { state: 'light' });
		within(r.parts.RL.amps, 1.188, halfUnit(3), 'OpenStax Ex. 21.4 current 1.188 A');
		within(r.nodes['B+'], 11.9, halfUnit(1), 'OpenStax Ex. 21.4 terminal voltage 11.9 V (3 s.f.)');
	});
	it('r = 0.100 ohm, 0.500 ohm load: 20.0 A at 10.0 V', () => {
		const r = solved(text(0.1), { state: 'heavy' });
		within(r.parts.RL.amps, 20.0, halfUnit(1), 'OpenStax Ex. 21.4 current 20.0 A (3 s.f.)');
		within(r.nodes['B+'], 10.0, halfUnit(1), 'OpenStax Ex. 21.4 terminal voltage 10.0 V (3 s.f.)');
	});
	it('r = 0.500 ohm, 0.500 ohm load: 12.0 A at 6.0 V', () => {
		const r = solved(text(0.5), { state: 'heavy' });
		within(r.parts.RL.amps, 12.0, halfUnit(1), 'OpenStax Ex. 21.4 current 12.0 A (3 s.f.)');
		within(r.nodes['B+'], 6.0, halfUnit(1), 'OpenStax Ex. 21.4 terminal voltage 6.0 V (2 s.f.)');
	});
});

describe('OpenStax College Physics, Chapter 21, Problem 23 (starter and corroded terminal)', () => {
	const text = `
supply: { volts: 12.0, ohms: 0.0100 }
parts:
  M1: { type: motor, ohms: 0.0500 }
wires:
  - B+ M1.1      # W1, the battery cable
  - M1.2 GND     # W2
`;
	it('clean: 200 A and 10.0 V at the starter', () => {
		const r = solved(text);
		within(r.parts.M1.amps, 200, 0.5, 'OpenStax Ch. 21 Problem 23: 200 A (3 s.f.)');
		within(r.nodes['M1.1'] - r.nodes['M1.2'], 10.0, halfUnit(1), 'OpenStax Ch. 21 Problem 23: 10.0 V at the starter (3 s.f.)');
	});
	it('corrosion adds 0.0900 ohm: 80 A and 4.00 V', () => {
		const r = solved(text, { fault: 'high-resistance:W1:0.09' });
		within(r.parts.M1.amps, 80, 0.5, 'OpenStax Ch. 21 Problem 23: 80 A');
		within(r.nodes['M1.1'] - r.nodes['M1.2'], 4.0, halfUnit(2), 'OpenStax Ch. 21 Problem 23: 4.00 V (3 s.f.)');
	});
});

describe('Lessons In Electric Circuits, Vol. I, ch. 6.1 (voltage divider)', () => {
	const text = `
supply: 45
parts:
  R1: { type: resistor, ohms: 5000 }
  R2: { type: resistor, ohms: 10000 }
  R3: { type: resistor, ohms: 7500 }
wires:
  - B+ R1.1
  - R1.2 R2.1
  - R2.2 R3.1
  - R3.2 GND
`;
	it('22.5 kohm, 2 mA, drops 10 / 20 / 15 V', () => {
		const r = solved(text);
		const n = r.nodes;
		// The book's divider has no meter; the spec's 10 Mohm meters on the two inner nodes load it by at
		// most 45 V x 3.9 kohm / 10 Mohm = 18 mV (hand estimate), so the drops are checked to 20 mV.
		const meterLoading = 0.02;
		within(r.parts.R1.amps, 0.002, ROUNDING_A, 'Lessons In Electric Circuits Vol. I 6.1: 2 mA');
		within(45 / r.parts.R3.amps, 22500, 600, 'Lessons In Electric Circuits Vol. I 6.1: 22.5 kohm (from a current rounded to 0.1 mA)');
		within(n['R1.1'] - n['R1.2'], 10, meterLoading, 'Lessons In Electric Circuits Vol. I 6.1: 10 V on 5 kohm');
		within(n['R2.1'] - n['R2.2'], 20, meterLoading, 'Lessons In Electric Circuits Vol. I 6.1: 20 V on 10 kohm');
		within(n['R3.1'] - n['R3.2'], 15, meterLoading, 'Lessons In Electric Circuits Vol. I 6.1: 15 V on 7.5 kohm');
	});
});

describe('DIN 72552 relay terminal roles', () => {
	const text = `
supply: 12.0
parts:
  S1: { type: switch }
  K1: { type: relay }
  LA: { type: lamp, ohms: 12 }
  LB: { type: lamp, ohms: 12 }
wires:
  - B+ K1.30
  - B+ S1.1
  - S1.2 K1.86
  - K1.85 GND
  - K1.87 LA.1
  - LA.2 GND
  - K1.87a LB.1
  - LB.2 GND
points:
  NO: K1.87
  NC: K1.87a
states:
  off: { S1: open }
  on: { S1: closed }
`;
	it('85/86 coil; 30 common joins 87a released and 87 energized', () => {
		const off = solved(text, { state: 'off' });
		expect(off.parts.K1.status, 'DIN 72552: coil 85-86 unfed, relay released').toBe('released');
		expect(off.parts.LB.status, 'DIN 72552: 87a normally closed, joined to 30').toBe('on');
		expect(off.parts.LA.status, 'DIN 72552: 87 normally open').toBe('off');
		expect(off.points.NC.reads).toBe('supply');
		expect(off.points.NO.reads).toBe('ground');
		const on = solved(text, { state: 'on' });
		expect(on.parts.K1.status, 'DIN 72552: coil 85-86 fed, relay energized').toBe('energized');
		expect(on.parts.LA.status, 'DIN 72552: 87 joined to 30 when energized').toBe('on');
		expect(on.parts.LB.status, 'DIN 72552: 87a open when energized').toBe('off');
	});
	it('a relay has no other terminals (pin 15 is an ignition terminal, not a relay pin)', () => {
		const bad = text.replace('K1.87a LB.1', 'K1.15 LB.1');
		const problems = checkCircuitText(bad);
		expect(problems.length, 'DIN 72552: relay pins are 30, 85, 86, 87, 87a').toBeGreaterThan(0);
		expect(problems.map((p) => `${p.key} ${p.message}`).join('\n')).toMatch(/15/);
	});
});

describe('IEC 60228 class 5 and HyperPhysics AWG wire resistance', () => {
	// Each branch: B+ -> sized wire -> 1 ohm resistor -> GND; V(R.1) = 12 / (1 + Rw).
	const mm2: [number, number, number][] = [
		// [size mm2, mohm per m (IEC 60228 class 5, 20 C), length m]
		[0.5, 39.0, 50],
		[0.75, 26.0, 75],
		[1, 19.5, 100],
		[1.5, 13.3, 100],
		[2.5, 7.98, 200],
		[4, 4.95, 300],
		[6, 3.3, 500]
	];
	const awg: [number, number][] = [
		// [gauge, ohm per 1000 ft (HyperPhysics, solid copper, 20 C)]; each wire 100 ft = 30.48 m
		[22, 16.14],
		[20, 10.15],
		[18, 6.385],
		[16, 4.016],
		[14, 2.525],
		[12, 1.588],
		[10, 0.9989]
	];
	const parts: string[] = [];
	const wires: string[] = [];
	mm2.forEach(([size, , len], i) => {
		parts.push(`  RM${i}: { type: resistor, ohms: 1 }`);
		wires.push(`  - { from: B+, to: RM${i}.1, gauge_mm2: ${size}, length_m: ${len} }`, `  - RM${i}.2 GND`);
	});
	awg.forEach(([g], i) => {
		parts.push(`  RA${i}: { type: resistor, ohms: 1 }`);
		wires.push(`  - { from: B+, to: RA${i}.1, gauge_awg: ${g}, length_m: 30.48 }`, `  - RA${i}.2 GND`);
	});
	const text = ['supply: 12.0', 'parts:', ...parts, 'wires:', ...wires, ''].join('\n');
	let cached: SolveResult | undefined;
	const result = () => (cached ??= solved(text));
	it.each(mm2.map(([s, m, l], i) => [s, m, l, i]))('%s mm2 at %s mohm/m (IEC 60228 class 5)', (size, mohm, len, i) => {
		const rw = (mohm / 1000) * len;
		within(result().nodes[`RM${i}.1`], 12 / (1 + rw), ROUNDING_V + 1e-4, `IEC 60228 class 5 ${size} mm2, ${len} m = ${rw} ohm`);
	});
	it.each(awg.map(([g, o], i) => [g, o, i]))('%s AWG at %s ohm per 1000 ft (HyperPhysics)', (g, per1000ft, i) => {
		const rw = per1000ft / 10; // 100 ft
		within(result().nodes[`RA${i}.1`], 12 / (1 + rw), ROUNDING_V + 1e-4, `HyperPhysics ${g} AWG, 100 ft = ${rw} ohm`);
	});
});

describe('Automotive mini relay catalogue, 12 V plug-in type: 80 ohm coil, operates at 7 V, releases at 1.2 V', () => {
	const direct = `
supply: 12.0
parts:
  K1: { type: relay }
wires:
  - B+ K1.86
  - K1.85 GND
  - B+ K1.30
states:
  at7: { supply: 7.0 }
  below7: { supply: 6.99 }
`;
	it('coil draws 12 / 80 = 0.150 A at 12 V (catalogue: 80 ohm, 150 mA)', () => {
		const r = solved(direct);
		within(r.parts.K1.amps, 0.15, ROUNDING_A, 'relay catalogue: 150 mA at 12 V');
		expect(r.parts.K1.status).toBe('energized');
	});
	it('operates at 7.0 V (worst case of "7 V or less"); not at 6.99 V', () => {
		expect(solved(direct, { state: 'at7' }).parts.K1.status, 'relay catalogue: operates at 7 V').toBe('energized');
		expect(solved(direct, { state: 'below7' }).parts.K1.status, 'relay catalogue: 6.99 V is below the worst-case pull-in').toBe('released');
	});
	// Releases at 1.2 V: feed the coil through R1 = 18 ohm and put RL on its own 87 contact. Released,
	// the coil sees 12 * 80 / 98 = 9.8 V and pulls in; energized, 80 || RL sits in series with R1. With
	// 80 || RL = 2 ohm (RL = 160/78) the coil sees 12 * 2 / 20 = 1.200 V (hand calculation; the meter
	// moves it by 0.03 uV) - not below drop-out, so it holds. With RL = 1.9 ohm, 80 || 1.9 = 1.855922 ohm,
	// 12 * 1.855922 / 19.855922 = 1.1216 V < 1.2 V: it releases, re-energizes, and chatters.
	const band = (rl: string) => `
supply: 12.0
parts:
  R1: { type: resistor, ohms: 18 }
  K1: { type: relay }
  RL: { type: resistor, ohms: ${rl} }
wires:
  - B+ R1.1
  - R1.2 K1.86
  - R1.2 K1.30
  - K1.85 GND
  - K1.87 RL.1
  - RL.2 GND
`;
	it('holds at exactly 1.2 V on the coil (release is below 1.2 V)', () => {
		const r = solved(band(String(160 / 78)));
		within(r.nodes['K1.86'], 1.2, ROUNDING_V, 'hand calculation: coil volts 1.200');
		expect(r.parts.K1.status, 'relay catalogue: releases at 1.2 V or more, so 1.200 V holds').toBe('energized');
	});
	it('releases below 1.2 V (and, feeding itself again, chatters)', () => {
		const r = solved(band('1.9'));
		expect(r.parts.K1.status, 'relay catalogue drop-out 1.2 V: 1.12 V releases').toBe('chattering');
	});
});

describe('Digital multimeter specification: 10 Mohm input draws about 1.2 uA at 12 V', () => {
	const text = `
supply: 12.0
parts:
  R1: { type: resistor, ohms: 1000000 }
  X: { type: splice }
wires:
  - B+ R1.1
  - R1.2 X
points:
  P: X
`;
	it('the meter on B+ draws 12 V / 10 Mohm = 1.2 uA', () => {
		const d = solveDetailed(parseCircuit(text));
		const meters = d.elements.filter((e) => e.kind === 'meter' && (e.from === 'B+' || e.to === 'B+'));
		expect(meters.length, 'one meter on the B+ node').toBe(1);
		within(Math.abs(meters[0].amps), 1.2e-6, 1e-9, 'DMM specification: about 1.2 uA at 12 V');
	});
	it('a 1 Mohm feed into the meter reads 12 * 10 / 11 = 10.909 V (hand calculation)', () => {
		const r = solved(text);
		within(r.points.P.volts, 12 * 10 / 11, ROUNDING_V + 1e-6, 'DMM 10 Mohm input with 1 Mohm in series');
		expect(r.points.P.reads).toBe('partial');
	});
});

describe('Rules of the trade (common practice)', () => {
	const sharedFuse = golden('shared-fuse.yaml');
	const fanRelay = golden('fan-relay.yaml');

	it('common practice: an open circuit carries no current, so it never blows a fuse', () => {
		const c = parseCircuit(sharedFuse);
		const opens = standardFaults(c).filter((f) => f.kind === 'open' && f.target !== 'F1');
		expect(opens.length).toBeGreaterThan(10);
		for (const f of opens) {
			const r = solveCircuit(c, { fault: f }) as SolveResult;
			expect(r.parts.F1.status, `common practice: ${formatFault(f)} leaves the fuse ok`).toBe('ok');
		}
	});

	it('common practice: a short to ground between fuse and load blows the fuse and takes out everything else on it', () => {
		const c = parseCircuit(sharedFuse);
		for (const w of ['W2', 'W3', 'W4', 'W5']) {
			const r = solveCircuit(c, { fault: `short-to-ground:${w}` }) as SolveResult;
			expect(r.parts.F1.status, `common practice: short on ${w}`).toBe('blown');
			for (const load of ['L1', 'M1', 'L2']) expect(r.parts[load].status, `common practice: ${load} with ${w} shorted`).toBe('off');
		}
	});

	it('common practice: with an open on the ground side every point up to the open reads source volts', () => {
		const text = `
supply: 12.6
parts:
  F1: { type: fuse, amps: 10 }
  S1: { type: switch, normally: closed }
  L1: { type: lamp, watts: 21 }
  G1: { type: ground }
wires:
  - B+ F1.1
  - F1.2 S1.1
  - S1.2 L1.1
  - L1.2 G1
points:
  A: F1.2
  B: S1.2
  C: L1.2
`;
		const sound = solved(text);
		expect(sound.points.C.reads).toBe('ground');
		for (const fault of ['open:W4', 'open:G1']) {
			const r = solved(text, { fault });
			for (const p of ['A', 'B', 'C']) {
				expect(r.points[p].reads, `common practice: ${fault}, point ${p}`).toBe('supply');
				within(r.points[p].volts, 12.6, 0.001, `common practice: ${fault}, point ${p} at source volts (meter current only)`);
			}
		}
	});

	it('common practice: a ground-side switch pin reads source volts open and about 0 V closed', () => {
		const c = parseCircuit(fanRelay);
		const off = solveCircuit(c, { state: 'off' }) as SolveResult;
		const on = solveCircuit(c, { state: 'on' }) as SolveResult;
		expect(off.points.A.reads, 'common practice: open ground-side switch').toBe('supply');
		within(off.points.A.volts, 12.6, 0.001, 'common practice: source volts');
		expect(on.points.A.reads, 'common practice: closed ground-side switch').toBe('ground');
		expect(on.points.A.volts).toBeLessThan(0.2);
	});

	it("common practice: a relay's load side reads 0 V released and source volts energized", () => {
		const c = parseCircuit(fanRelay);
		const off = solveCircuit(c, { state: 'off' }) as SolveResult;
		const on = solveCircuit(c, { state: 'on' }) as SolveResult;
		expect(off.parts.K1.status).toBe('released');
		within(off.points.B.volts, 0, 0.001, 'common practice: released load side 0 V');
		expect(on.parts.K1.status).toBe('energized');
		expect(on.points.B.reads, 'common practice: energized load side at source volts').toBe('supply');
	});

	it('common practice: voltage drop under load - under 0.5 V feed side, under 0.2 V ground side, about 0.1 V per poor connection', () => {
		// A sound headlamp circuit on 1.5 mm2 wire (IEC 60228: 13.3 mohm/m): feed 3 m + 2 m through a
		// connector, ground lead 1 m. Lamp 12^2 / 55 = 2.618 ohm, about 4.5 A: hand estimate feed drop
		// 4.5 x (0.001 + 0.0665) = 0.30 V, ground drop 4.5 x 0.0133 = 0.06 V.
		const text = `
supply: 12.0
parts:
  F1: { type: fuse, amps: 15 }
  C1: { type: connector, cavities: 1 }
  L1: { type: lamp, watts: 55 }
  G1: { type: ground }
wires:
  - B+ F1.1
  - { from: F1.2, to: C1.1a, gauge_mm2: 1.5, length_m: 3 }
  - { from: C1.1b, to: L1.1, gauge_mm2: 1.5, length_m: 2 }
  - { from: L1.2, to: G1, gauge_mm2: 1.5, length_m: 1 }
points:
  FEED: L1.1
  RET: L1.2
`;
		const r = solved(text);
		const feedDrop = 12 - r.points.FEED.volts;
		expect(feedDrop, 'common practice: whole feed side under 0.5 V').toBeLessThan(0.5);
		within(feedDrop, 0.30, 0.02, 'hand estimate of the feed drop');
		expect(r.points.RET.volts, 'common practice: ground side under 0.2 V').toBeLessThan(0.2);
		// A poor connection of 0.022 ohm in the connector adds about 0.1 V (4.4 A x 0.022 ohm).
		const poor = solved(text, { fault: 'high-resistance:C1.1:0.022' });
		within(r.points.FEED.volts - poor.points.FEED.volts, 0.1, 0.01, 'common practice: about 0.1 V per connection');
	});
});
