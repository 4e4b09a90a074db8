/**
 * Faults in words, for stems and option labels.
 */
import { parseFault, type Circuit } from '../circuit';

/** True when a text names a wire by its id (W3): the diagram beside it should then draw wire ids. */
export function namesWire(text: string): boolean {
	return /\bW\d+\b/.test(text);
}

/** `faultWords` for screens: the fault's plain text when there is no circuit or the fault cannot be read. */
export function faultText(ctx: { circuit: Pick<Circuit, 'parts' | 'wires'> } | null, fault: string): string {
	if (!ctx) return fault;
	try {
		return faultWords(ctx, fault);
	} catch {
		return fault;
	}
}

/** A fault in words, for stems, option labels and feedback captions (only the circuit's parts and wires are read). */
export function faultWords(ctx: { circuit: Pick<Circuit, 'parts' | 'wires'> }, fault: string): string {
	const f = parseFault(fault);
	const t = f.target;
	const part = ctx.circuit.parts.find((p) => p.id === t.split('.')[0]);
	const isWire = ctx.circuit.wires.some((w) => w.id === t);
	switch (f.kind) {
		case 'open':
			if (isWire) return `an open in wire ${t}`;
			if (t.endsWith('.coil')) return `an open coil in relay ${part?.id}`;
			if (/\.87a?$/.test(t)) return `relay ${part?.id}'s pin ${t.split('.')[1]} contact never closing`;
			if (part?.type === 'connector') return `a pushed-out terminal in connector ${part.id}, cavity ${t.split('.')[1]}`;
			if (part?.type === 'ground') return `a broken ground bond at ${t}`;
			if (part?.type === 'lamp') return `lamp ${t} burnt out`;
			if (part?.type === 'fuse' || part?.type === 'fusible-link') return `fuse ${t} open`;
			if (part?.type === 'switch') return `switch ${t} never closing`;
			return `an open inside ${t}`;
		case 'shorted':
			return t.endsWith('.coil') ? `a shorted coil in relay ${part?.id}` : `${t} shorted inside`;
		case 'stuck-closed':
			return part?.type === 'relay' ? `relay ${t}'s contacts welded closed` : `switch ${t} stuck closed`;
		case 'short-to-ground':
			return `wire ${t} rubbed through to ground`;
		case 'short-to-power':
			return `wire ${t} shorted to battery positive`;
		case 'short-between':
			return `wires ${t.replace(',', ' and ')} shorted together`;
		case 'high-resistance':
			if (part?.type === 'ground') return `${f.ohms ?? 1} Ω of corrosion at ground ${t}`;
			if (part?.type === 'connector') return `${f.ohms ?? 1} Ω of corrosion in connector ${part.id}, cavity ${t.split('.')[1]}`;
			return `${f.ohms ?? 1} Ω of extra resistance in wire ${t}`;
	}
}


/**
 * Numbers in a sentence as a person reads them off a meter: volts and ohms to at most 2 decimals,
 * amps and watts to 3 significant figures (308.6478 A → 309 A, 4.3915 A → 4.39 A, 12.449 V → 12.45 V).
 * Only a number with a decimal point directly followed by a unit is touched, and only when it has more
 * decimals than that; a number that rounds to zero loses its minus sign.
 * For display only: keys, tolerances and grading keep the engine's full values.
 */
export function tidyNumbers(text: string): string {
	return text.replace(/(-?\d+\.\d+)(\s?)(mA|V|A|W|Ω)(?![\w])/g, (whole, num: string, space: string, unit: string) => {
		const x = Number(num);
		if (!Number.isFinite(x)) return whole;
		const decimals = num.split('.')[1].length;
		let digits: number;
		if (unit === 'V' || unit === 'Ω') digits = 2;
		else digits = x === 0 ? 2 : Math.max(0, 2 - Math.floor(Math.log10(Math.abs(x))));
		if (decimals <= digits) return whole;
		const shown = x.toFixed(digits);
		return `${/^-0(\.0*)?$/.test(shown) ? shown.slice(1) : shown}${space}${unit}`;
	});
}
