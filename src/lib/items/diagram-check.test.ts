/**
 * The build's diagram check on samples of every family: the diagram module's geometry rules
 * (checkDrawing) and the build's own find nothing to report; a circuit that cannot be drawn is
 * reported as a sentence, never thrown.
 */
import { describe, expect, it } from 'vitest';
import { checkDiagram } from './diagram-check';
import { FAMILIES } from './families';
import { makeRng } from './rng';

describe('diagram check on family samples', () => {
	for (const f of FAMILIES)
		it(`${f.id}: five variants draw cleanly`, () => {
			for (let k = 0; k < 5; k++) expect(checkDiagram(f.variant(makeRng(`splicepoint|${f.id}|${k}`), k).circuit), `${f.id} variant ${k}`).toEqual([]);
		});

	it('a circuit the engine refuses is reported, not thrown', () => {
		const out = checkDiagram('supply: 12\nparts:\n  L1: { type: lamp }\nwires: []\n');
		expect(out).toHaveLength(1);
		expect(out[0]).toMatch(/^the diagram cannot be drawn: /);
	});
});
