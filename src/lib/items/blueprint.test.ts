/**
 * The blueprint: areas and weights, skills each in one area with a prior difficulty, and the safety
 * cautions (reference-values.md, "Safety cautions") shown where the work can hurt someone.
 */
import { describe, expect, it } from 'vitest';
import { AREAS, CAUTIONS, SKILLS, cautionsFor, findSkill, isArea } from './blueprint';

describe('blueprint', () => {
	it('weights sum to 100 % and every area has skills', () => {
		expect(AREAS.reduce((a, b) => a + b.weight, 0)).toBe(100);
		for (const a of AREAS) expect(SKILLS.some((s) => s.area === a.id), a.id).toBe(true);
	});
	it('each skill sits in one known area with a prior difficulty between −2 and +2, ids unique', () => {
		expect(new Set(SKILLS.map((s) => s.id)).size).toBe(SKILLS.length);
		for (const s of SKILLS) {
			expect(isArea(s.area), s.id).toBe(true);
			expect(Math.abs(s.difficulty)).toBeLessThanOrEqual(2);
			expect(findSkill(s.id)).toBe(s);
		}
	});
	it('battery work shows hydrogen, jewellery and ground-cable cautions (CCOHS, OSH Answers, "Battery charging"; common practice)', () => {
		const ids = cautionsFor('charging', 'charging-voltage', []).map((c) => c.id);
		expect(ids).toEqual(['hydrogen', 'jewellery', 'ground-first', 'service-info']);
		expect(cautionsFor('lighting-signalling', 'lamp-circuits', ['battery']).map((c) => c.id)).toContain('hydrogen');
	});
	it('airbag and high-voltage tags add their cautions; other items show none', () => {
		expect(cautionsFor('sensors-inputs', 'sensor-reference', ['airbag']).map((c) => c.id)).toEqual(['airbag', 'service-info']);
		expect(cautionsFor('motors-body', 'relay-loads', ['high-voltage']).map((c) => c.id)).toEqual(['high-voltage', 'service-info']);
		expect(cautionsFor('diagnostic-strategy', 'next-test', ['battery']).map((c) => c.id)).toContain('no-piercing');
		expect(cautionsFor('lighting-signalling', 'lamp-circuits', [])).toEqual([]);
	});
	it('the caution texts carry the reference list’s substance', () => {
		expect(CAUTIONS.hydrogen.text).toMatch(/hydrogen.*explosive/i);
		expect(CAUTIONS.airbag.text).toMatch(/test lamp/);
		expect(CAUTIONS.highVoltage.text).toMatch(/orange/);
		expect(CAUTIONS.groundFirst.text).toMatch(/ground cable first/);
	});
});
