// Symbols against the spec's pin table (circuit-format.md, "Parts and their pins") and DIN 72552.
import { describe, expect, it } from 'vitest';
import { buildSymbol, GRID, listPins, PART_TYPES, type DiagramPart, type PartType } from './index';

// circuit-format.md, "Parts and their pins": the pins each type has.
const SPEC_PINS: Record<PartType, string[]> = {
	fuse: ['1', '2'],
	'fusible-link': ['1', '2'],
	breaker: ['1', '2'],
	relay: ['30', '85', '86', '87', '87a'],
	switch: ['1', '2'],
	lamp: ['1', '2'],
	motor: ['1', '2'],
	horn: ['1', '2'],
	heater: ['1', '2'],
	solenoid: ['1', '2'],
	resistor: ['1', '2'],
	diode: ['a', 'k'],
	supply: ['+', '-'],
	connector: ['1a', '1b', '2a', '2b', '3a', '3b'],
	splice: ['SP1'],
	ground: ['G1']
};

function sample(type: PartType): DiagramPart {
	const id = type === 'splice' ? 'SP1' : type === 'ground' ? 'G1' : 'X1';
	return { id, type, cavities: 3, amps: 10 };
}

describe('symbols', () => {
	it('cover every part type of the spec', () => {
		expect([...PART_TYPES].sort()).toEqual(Object.keys(SPEC_PINS).sort());
	});

	for (const type of PART_TYPES) {
		it(`${type}: has exactly the spec's pins, each on the footprint edge and on the grid`, () => {
			const part = sample(type);
			expect(listPins(part)).toEqual(SPEC_PINS[type]);
			const top = new Set([listPins(part)[0]]);
			const s = buildSymbol(part, { top, pitch: 40 });
			expect(Object.keys(s.pins).sort()).toEqual([...SPEC_PINS[type]].sort());
			for (const [pin, xy] of Object.entries(s.pins)) {
				if (type !== 'splice') expect([0, s.h], `${type} pin ${pin} on the top or bottom edge`).toContain(xy.y);
				expect(xy.x % GRID === 0 || type === 'splice', `${type} pin ${pin} x on the grid`).toBe(true);
				expect(xy.x).toBeGreaterThanOrEqual(0);
				expect(xy.x).toBeLessThanOrEqual(s.w);
			}
			expect(s.body.length).toBeGreaterThan(20);
		});
	}

	it('a relay prints its DIN 72552 terminal numbers: coil 85/86, common 30, NO 87, NC 87a', () => {
		const s = buildSymbol({ id: 'K1', type: 'relay' }, { top: new Set(['86', '30']), pitch: 40 });
		for (const n of ['30', '85', '86', '87', '87a']) expect(s.body).toContain(`>${n}</text>`);
		// The coil lane sits beside the contact lane, the load contact 87 straight under 30.
		expect(s.pins['86'].x).toBe(s.pins['85'].x);
		expect(s.pins['87'].x).toBe(s.pins['30'].x);
		expect(s.pins['30'].x).toBeGreaterThan(s.pins['86'].x);
		expect(s.subs.map((b) => b.id)).toEqual(['K1.coil', 'K1.contact']);
	});

	it('a relay at rest rests 30 on 87a; pulled in, on 87', () => {
		const rest = buildSymbol({ id: 'K1', type: 'relay' }, { top: new Set(['86', '30']), pitch: 40 });
		const pulled = buildSymbol({ id: 'K1', type: 'relay' }, { top: new Set(['86', '30']), pitch: 40, energized: true });
		expect(rest.body).not.toBe(pulled.body);
	});

	it('a switch is drawn in its position: open and closed differ, a positioned switch joins its pins', () => {
		const sw: DiagramPart = { id: 'S1', type: 'switch' };
		const open = buildSymbol(sw, { top: new Set(['1']), pitch: 40, setting: 'open' });
		const closed = buildSymbol(sw, { top: new Set(['1']), pitch: 40, setting: 'closed' });
		expect(open.body).not.toBe(closed.body);
		const pos: DiagramPart = { id: 'S2', type: 'switch', positions: { off: [], low: [['B', 'L']], high: [['B', 'H']] } };
		const shapes = ['off', 'low', 'high'].map((p) => buildSymbol(pos, { top: new Set(['B']), pitch: 40, setting: p }).body);
		expect(new Set(shapes).size).toBe(3);
		expect(Object.keys(buildSymbol(pos, { top: new Set(['B']), pitch: 40 }).pins).sort()).toEqual(['B', 'H', 'L']);
	});

	it('a connector numbers its cavities and gives each its own lane', () => {
		const s = buildSymbol({ id: 'C1', type: 'connector', cavities: 3 }, { top: new Set(['1a', '2a', '3a']), pitch: 50 });
		for (const n of ['1', '2', '3']) expect(s.body).toContain(`>${n}</text>`);
		expect(s.laneX).toEqual([10, 60, 110]);
		expect(s.subs.map((b) => b.id)).toEqual(['C1.1', 'C1.2', 'C1.3']);
	});

	it('a diode points from anode to cathode whichever end is on top', () => {
		const d: DiagramPart = { id: 'D1', type: 'diode' };
		const aTop = buildSymbol(d, { top: new Set(['a']), pitch: 40 });
		const kTop = buildSymbol(d, { top: new Set(['k']), pitch: 40 });
		expect(aTop.pins.a.y).toBe(0);
		expect(kTop.pins.k.y).toBe(0);
		expect(aTop.body).not.toBe(kTop.body);
	});

	it('a blown fuse or link is drawn with its element broken; a tripped breaker with its contact open', () => {
		for (const type of ['fuse', 'fusible-link', 'breaker'] as const) {
			const part: DiagramPart = { id: 'F1', type, amps: 10 };
			const ok = buildSymbol(part, { top: new Set(['1']), pitch: 40 });
			const blown = buildSymbol(part, { top: new Set(['1']), pitch: 40, blown: true });
			expect(blown.body, type).not.toBe(ok.body);
			// No conductor runs through from one pin to the other.
			expect(blown.body).not.toContain('x1="10" y1="0" x2="10" y2="60"');
		}
	});
});
