// The answer history names each question by its opening words, as plain text.
import { describe, expect, it } from 'vitest';
import { stemExcerpt } from './history';

describe('stemExcerpt', () => {
	it('drops markup and decodes the entities the sanitizer writes', () => {
		expect(stemExcerpt('<p><strong>2 heaters in parallel</strong> (12.7 V battery; H1 10&nbsp;Ω). Read point <strong>A</strong> &amp; B.</p>')).toBe(
			'2 heaters in parallel (12.7 V battery; H1 10 Ω). Read point A & B.'
		);
	});
	it('cuts a long stem at a word with an ellipsis', () => {
		const long = `<p>${'With switch S1 closed and relay K1 energized, '.repeat(6)}what does the meter read?</p>`;
		const out = stemExcerpt(long, 80);
		expect(out.endsWith('…')).toBe(true);
		expect(out.length).toBeLessThanOrEqual(81);
		expect(out).not.toMatch(/[,\s]…$/);
		expect(long.replace(/<[^>]*>/g, '')).toContain(out.slice(0, -1));
	});
});
