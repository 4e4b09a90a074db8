import { describe, expect, it } from 'vitest';
import { isTimeZone, timeZoneNames } from './time-zone';

// Source: the IANA time zone database (tzdata), zone1970.tab and backward (links such as US/Central).
describe('isTimeZone', () => {
	it.each(['America/Chicago', 'Europe/Berlin', 'Asia/Kolkata', 'Pacific/Auckland', 'America/Argentina/Buenos_Aires', 'UTC', 'US/Central'])(
		'accepts %s',
		(zone) => expect(isTimeZone(zone)).toBe(true)
	);

	it.each(['', 'Mars/Olympus_Mons', 'America/Chicag', 'GMT+25', 'Europe/Berlin; DROP TABLE user', '../../etc/passwd'])(
		'refuses %j',
		(zone) => expect(isTimeZone(zone)).toBe(false)
	);

	it('offers UTC first and every zone once', () => {
		const zones = timeZoneNames();
		expect(zones[0]).toBe('UTC');
		expect(new Set(zones).size).toBe(zones.length);
		expect(zones).toContain('America/Denver');
	});
});
