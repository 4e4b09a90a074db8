import { describe, expect, it } from 'vitest';
import { addDays, daysBetween, learningDay, learningDayStart } from './learning-day';

// Offsets and change dates from the IANA time zone database (tzdata): America/Denver is UTC−6 (MDT) until
// 2026-11-01 02:00 local, then UTC−7 (MST) — the US rule, first Sunday of November (Energy Policy Act of
// 2005). Europe/Berlin is UTC+1 (CET) until 2026-03-29 01:00 UTC, then UTC+2 (CEST) — EU Directive
// 2000/84/EC, last Sunday of March. A learning day starts at 04:00 local (docs/learning.md).
describe('learning days', () => {
	it.each([
		['2026-10-31', 'America/Denver', '2026-10-31T10:00:00.000Z'], // 04:00 MDT
		['2026-11-01', 'America/Denver', '2026-11-01T11:00:00.000Z'], // 04:00 MST, after the change at 02:00
		['2026-11-02', 'America/Denver', '2026-11-02T11:00:00.000Z'],
		['2026-03-28', 'Europe/Berlin', '2026-03-28T03:00:00.000Z'], // 04:00 CET
		['2026-03-29', 'Europe/Berlin', '2026-03-29T02:00:00.000Z'], // 04:00 CEST, after the change at 02:00 CET
		['2026-07-01', 'UTC', '2026-07-01T04:00:00.000Z'],
		['2026-07-01', 'Asia/Tokyo', '2026-06-30T19:00:00.000Z'], // JST is UTC+9 all year
		['2026-07-01', 'Asia/Kolkata', '2026-06-30T22:30:00.000Z'], // IST is UTC+5:30
		['2026-10-04', 'Australia/Sydney', '2026-10-03T17:00:00.000Z'] // AEDT (UTC+11) from 2026-10-04 02:00 local, first Sunday of October
	])('%s in %s starts at %s', (day, zone, iso) => {
		expect(learningDayStart(day, zone).toISOString()).toBe(iso);
	});

	it('the learning day that ends at a DST change is 25 h (Denver, November) or 23 h (Berlin, March) long', () => {
		const hours = (day: string, zone: string) => (learningDayStart(addDays(day, 1), zone).getTime() - learningDayStart(day, zone).getTime()) / 3_600_000;
		expect(hours('2026-10-31', 'America/Denver')).toBe(25);
		expect(hours('2026-03-28', 'Europe/Berlin')).toBe(23);
		expect(hours('2026-06-10', 'Europe/Berlin')).toBe(24);
	});

	it.each([
		// Denver, 03:59 MST on 1 November still belongs to 31 October; 04:00 MST begins 1 November.
		['2026-11-01T10:59:59Z', 'America/Denver', '2026-10-31'],
		['2026-11-01T11:00:00Z', 'America/Denver', '2026-11-01'],
		// 01:30 MST on 1 November happens after the 01:00–02:00 hour repeats: still 31 October.
		['2026-11-01T08:30:00Z', 'America/Denver', '2026-10-31'],
		// Berlin, 03:59 CEST on 29 March (01:59 UTC) belongs to 28 March; 04:00 CEST begins 29 March.
		['2026-03-29T01:59:00Z', 'Europe/Berlin', '2026-03-28'],
		['2026-03-29T02:00:00Z', 'Europe/Berlin', '2026-03-29'],
		// A late-night session (23:30 local) counts for that evening's date.
		['2026-03-27T22:30:00Z', 'Europe/Berlin', '2026-03-27']
	])('the instant %s in %s is in learning day %s', (iso, zone, day) => {
		expect(learningDay(iso, zone)).toBe(day);
	});

	it('counts calendar days and adds them across month and year ends', () => {
		expect(addDays('2026-12-30', 3)).toBe('2027-01-02');
		expect(daysBetween('2026-02-27', '2026-03-01')).toBe(2); // 2026 is not a leap year
		expect(daysBetween('2028-02-27', '2028-03-01')).toBe(3); // 2028 is
	});

	it('names what is wrong with a bad zone, day or instant', () => {
		expect(() => learningDay('2026-01-01T00:00:00Z', 'Mars/Olympus')).toThrow(/Unknown time zone "Mars\/Olympus"/);
		expect(() => learningDayStart('2026-02-30', 'UTC')).toThrow(/Not a valid day: "2026-02-30"/);
		expect(() => learningDay('yesterday', 'UTC')).toThrow(/Not a valid instant/);
	});
});
