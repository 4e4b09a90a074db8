/**
 * What-if options (each models one learner mistake) and explanations, on a relay-switched lamp.
 * Expected values are hand calculations or rules of the trade marked "common practice".
 */
import { describe, expect, it } from 'vitest';
import { explainSolve, meterReading, parseCircuit, solveCircuit, type SolveResult } from './index';
import { LAMP_RELAY } from './test-fixtures';

const c = parseCircuit(LAMP_RELAY);
const solve = (o: Parameters<typeof solveCircuit>[1]) => solveCircuit(c, o) as SolveResult;

describe('what-if: force a relay state', () => {
	it('a relay held released leaves the lamp off with the switch on', () => {
		expect(solve({ state: 'on' }).parts.L1.status).toBe('on');
		const r = solve({ state: 'on', whatIf: { relays: { K1: 'released' } } });
		expect(r.parts.K1.status).toBe('released');
		expect(r.parts.L1.status).toBe('off');
		// common practice: the contact side of a released relay reads 0 V at the load
		expect(r.points.B.reads).toBe('ground');
	});
	it('a relay held energized lights the lamp with the switch off', () => {
		const r = solve({ state: 'off', whatIf: { relays: { K1: 'energized' } } });
		expect(r.parts.L1.status).toBe('on');
		// common practice: the contact side of an energized relay reads source volts
		expect(r.points.A.reads).toBe('supply');
	});
	it('names an unknown relay', () => {
		expect(() => solveCircuit(c, { state: 'on', whatIf: { relays: { K9: 'energized' } } })).toThrow(/"K9" is not a relay/);
	});
});

describe('what-if: no fuse opens', () => {
	it('a short to ground after the fuse blows it; forgetting that, the fuse reads ok while carrying the short current', () => {
		const real = solve({ state: 'on', fault: 'short-to-ground:W6' });
		// common practice: a short to ground between the fuse and the load blows the fuse and kills the load
		expect(real.parts.F1.status).toBe('blown');
		expect(real.parts.L1.status).toBe('off');
		const wrong = solve({ state: 'on', fault: 'short-to-ground:W6', whatIf: { noFuseOpens: true } });
		expect(wrong.parts.F1.status).toBe('ok');
		// hand: 12.6 V over F1's 1 mΩ plus the 0.01 Ω short is 1145 A, plus about 1.7 A in the lamp and coil
		expect(wrong.parts.F1.amps).toBeGreaterThan(1145);
		expect(wrong.parts.F1.amps).toBeLessThan(1150);
	});
});

describe('what-if: read the far side of the open', () => {
	it('with the lamp feed broken, each end of the break reads as the other end', () => {
		const real = solve({ state: 'on', fault: 'open:W6' });
		// the relay side of the break still has source volts; the lamp side is pulled to ground through the lamp
		expect(real.points.A.reads).toBe('supply');
		expect(real.points.B.reads).toBe('ground');
		const wrong = solve({ state: 'on', fault: 'open:W6', whatIf: { farSideOfOpen: true } });
		expect(wrong.points.A).toEqual(real.points.B);
		expect(wrong.points.B).toEqual(real.points.A);
		expect(wrong.points.C).toEqual(real.points.C);
	});
});

describe('what-if: read with a test lamp instead of a meter', () => {
	it('an open lamp ground: the meter reads source volts after the lamp, a test lamp there reads half', () => {
		const meter = solve({ state: 'on', fault: 'open:W7' });
		// common practice: with an open on the ground side, every point up to the open reads source volts
		expect(meter.points.C.reads).toBe('supply');
		const lamp = solve({ state: 'on', fault: 'open:W7', whatIf: { lampReadings: true } });
		// hand: the 21 W test lamp (7.56 Ω at 12.6 V) in series with L1 (7.56 Ω) and F1 (1 mΩ):
		// V(C) = 12.6 × 7.56 / 15.121 = 6.2996 V
		expect(lamp.points.C.volts).toBeCloseTo(6.2996, 3);
		expect(lamp.points.C.reads).toBe('partial');
	});
});

describe('explainSolve', () => {
	it('tells the settling story of a short: relay pulls in, the fuse opens on its current, the relay drops out', () => {
		const x = explainSolve(c, { state: 'on', fault: 'short-to-ground:W6' });
		if ('error' in x) throw new Error('unexpected dead short');
		expect(x.events.map((e) => e.kind + ':' + ('id' in e ? e.id : ''))).toEqual(['relay:K1', 'fuse:F1', 'relay:K1']);
		const f1 = x.fuses.find((f) => f.id === 'F1')!;
		expect(f1.opened).toBe('overcurrent');
		expect(f1.amps_at_open).toBeGreaterThan(f1.rating);
		expect(x.relays[0]).toMatchObject({ id: 'K1', status: 'released', reason: 'dropped-out', pull_in: 7, drop_out: 1.2 });
	});
	it('explains a floating point by the open elements around it', () => {
		// with the coil ground wire broken and the switch open, K1.85 has no path anywhere
		const x = explainSolve(c, { state: 'off', fault: 'open:W4' });
		if ('error' in x) throw new Error('unexpected dead short');
		const e = x.points.find((p) => p.point === 'E')!;
		expect(e.reads).toBe('floating');
		expect(e.openings).toEqual(['S1', 'W4']);
	});
	it('lists where the volts drop and which path feeds the working lamp', () => {
		const x = explainSolve(c, { state: 'on' });
		if ('error' in x) throw new Error('unexpected dead short');
		const lampDrop = x.drops.find((d) => d.element === 'L1')!;
		// hand: 21 W at 12.6 V is 7.56 Ω, about 1.667 A; nearly all 12.6 V drops across it
		expect(lampDrop.amps).toBeCloseTo(1.6666, 3);
		expect(lampDrop.volts).toBeCloseTo(12.598, 2);
		expect(x.paths).toEqual([
			{ through: 'L1', elements: ['F1', 'K1.contact', 'L1', 'G1', 'W1', 'W5', 'W6', 'W7'], text: expect.stringContaining('L1 (on') }
		]);
	});
});

describe('meterReading (two leads)', () => {
	it('reads the drops of a series circuit (OpenStax College Physics Example 21.1)', () => {
		// 12.0 V; 1.00, 6.00, 13.0 Ω in series: 0.600 A; drops 0.600, 3.60, 7.80 V
		const series = parseCircuit(`supply: 12
parts:
  R1: { type: resistor, ohms: 1 }
  R2: { type: resistor, ohms: 6 }
  R3: { type: resistor, ohms: 13 }
wires:
  - B+ R1.1
  - R1.2 R2.1
  - R2.2 R3.1
  - R3.2 GND
points:
  A: R2.1
  B: R2.2
`);
		const r = solveCircuit(series) as SolveResult;
		expect(meterReading(r, 'B+', 'A')).toBeCloseTo(0.6, 3);
		expect(meterReading(r, 'A', 'B')).toBeCloseTo(3.6, 3);
		expect(meterReading(r, 'B', 'GND')).toBeCloseTo(7.8, 3);
		// leads the other way round read negative
		expect(meterReading(r, 'B', 'A')).toBeCloseTo(-3.6, 3);
		expect(() => meterReading(r, 'Q', 'GND')).toThrow(/red lead's "Q"/);
	});
	it('reads the voltage drop of a lamp ground across the open ground wire as source volts (common practice)', () => {
		// with the lamp's ground wire broken no current flows: L1.2 rises to source volts, so a meter
		// from L1.2 to the ground point reads the whole 12.6 V
		const r = solve({ state: 'on', fault: 'open:W7' });
		expect(meterReading(r, 'C', 'G1')).toBeCloseTo(12.6, 3);
	});
});
