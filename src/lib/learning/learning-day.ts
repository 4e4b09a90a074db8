/**
 * Learning days: a learner's day runs from 04:00 to 04:00 local time in their stored IANA time zone, so a
 * late-night session still counts for the evening it started in. Days are 'YYYY-MM-DD' strings.
 */

/** The hour (local wall time) at which a learning day begins. */
export const DAY_START_HOUR = 4;

const MS_PER_DAY = 86_400_000;
const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(timeZone: string): Intl.DateTimeFormat {
	let f = formatters.get(timeZone);
	if (!f) {
		try {
			f = new Intl.DateTimeFormat('en-US', {
				timeZone,
				hourCycle: 'h23',
				year: 'numeric',
				month: '2-digit',
				day: '2-digit',
				hour: '2-digit',
				minute: '2-digit',
				second: '2-digit'
			});
		} catch {
			throw new RangeError(`Unknown time zone "${timeZone}": use an IANA name such as "Europe/Berlin".`);
		}
		formatters.set(timeZone, f);
	}
	return f;
}

/** The local wall-clock time of an instant, as if it were UTC (milliseconds). */
function wallMs(instantMs: number, timeZone: string): number {
	const parts: Record<string, number> = {};
	for (const p of formatter(timeZone).formatToParts(new Date(instantMs))) if (p.type !== 'literal') parts[p.type] = Number(p.value);
	return Date.UTC(parts.year, parts.month - 1, parts.day, parts.hour, parts.minute, parts.second) + (instantMs % 1000 + 1000) % 1000;
}

/** Milliseconds since the epoch of a date input; throws a RangeError naming a bad value. */
export function toMs(instant: Date | string | number): number {
	const ms = instant instanceof Date ? instant.getTime() : typeof instant === 'number' ? instant : Date.parse(instant);
	if (!Number.isFinite(ms)) throw new RangeError(`Not a valid instant: "${String(instant)}". Use an ISO 8601 date-time or epoch milliseconds.`);
	return ms;
}

const DAY_RE = /^(\d{4})-(\d{2})-(\d{2})$/;

function dayToUtcMs(day: string): number {
	const m = DAY_RE.exec(day);
	const ms = m ? Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])) : NaN;
	if (!m || !Number.isFinite(ms) || new Date(ms).toISOString().slice(0, 10) !== day)
		throw new RangeError(`Not a valid day: "${day}". Use the form YYYY-MM-DD.`);
	return ms;
}

/** The learning day ('YYYY-MM-DD') that an instant falls in, for a learner in `timeZone`. */
export function learningDay(instant: Date | string | number, timeZone: string): string {
	const wall = wallMs(toMs(instant), timeZone) - DAY_START_HOUR * 3_600_000;
	return new Date(wall).toISOString().slice(0, 10);
}

/**
 * The instant a learning day starts: 04:00 local on that date. (No zone in use moves its clocks across
 * 04:00; if one did, this returns an instant within the hour of the gap.)
 */
export function learningDayStart(day: string, timeZone: string): Date {
	const target = dayToUtcMs(day) + DAY_START_HOUR * 3_600_000;
	// Two fixed-point steps on the zone offset settle it on either side of a change.
	let guess = target - (wallMs(target, timeZone) - target);
	guess = target - (wallMs(guess, timeZone) - guess);
	return new Date(guess);
}

/** `day` plus `n` calendar days. */
export function addDays(day: string, n: number): string {
	return new Date(dayToUtcMs(day) + n * MS_PER_DAY).toISOString().slice(0, 10);
}

/** Whole calendar days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
	return Math.round((dayToUtcMs(to) - dayToUtcMs(from)) / MS_PER_DAY);
}

/** Throws a RangeError unless `day` is a valid 'YYYY-MM-DD'. */
export function checkDay(day: string): string {
	dayToUtcMs(day);
	return day;
}
