/**
 * Faults in words, for stems and option labels.
 */
import { parseFault } from '../circuit';
import type { CircuitCtx } from './engine';

/** A fault in words, for stems. */
export function faultWords(ctx: CircuitCtx, fault: string): string {
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

