const SUPPORTED = new Set(Intl.supportedValuesOf('timeZone'));

/**
 * True for an IANA zone name this server can count days in. Intl.supportedValuesOf('timeZone') lists canonical
 * names only and leaves out 'UTC' and links such as a browser's newer spelling of an old name, so a name missing
 * from the list is accepted when Intl itself resolves it.
 */
export function isTimeZone(name: string): boolean {
	if (SUPPORTED.has(name)) return true;
	if (!/^[A-Za-z][A-Za-z0-9_+\-/]{0,63}$/.test(name)) return false;
	try {
		new Intl.DateTimeFormat('en', { timeZone: name });
		return true;
	} catch {
		return false;
	}
}

export function timeZoneNames(): string[] {
	return ['UTC', ...SUPPORTED].filter((z, i, all) => all.indexOf(z) === i);
}
