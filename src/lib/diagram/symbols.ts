/**
 * Schematic symbols, drawn in Splicepoint's own style on a 10 px grid. Every symbol is a footprint
 * (w × h, origin top-left) with its pins on the footprint's top or bottom edge, so a wire meets a pin
 * without crossing the body. Pins sit on multiples of GRID so the router can reach them.
 *
 * Pure: returns SVG markup strings, no DOM.
 */
import { listLanes, listPins, positionPins, type DiagramPart, type PartType } from './model';

export const GRID = 10;

export type SymbolPin = { x: number; y: number; exit: 'up' | 'down' | 'any' };
export type SubBox = { id: string; x: number; y: number; w: number; h: number };
export type SymbolShape = {
	w: number;
	h: number;
	pins: Record<string, SymbolPin>;
	/** SVG markup in footprint coordinates. */
	body: string;
	/** x of each lane's axis, relative to the footprint's left edge. */
	laneX: number[];
	/** Parts of the symbol that a current path can name alone: a relay's coil and contact, a cavity. */
	subs: SubBox[];
};

export type SymbolOptions = {
	/** Pins drawn on the top edge; the others go on the bottom. */
	top: Set<string>;
	/** Distance between lane axes for multi-lane parts (relay, connector), a multiple of GRID. */
	pitch: number;
	/** Switch setting in force: 'open', 'closed' or a position name. */
	setting?: string | null;
	/** Relay contact drawn pulled in (30 on 87) rather than at rest (30 on 87a). */
	energized?: boolean;
	/** A fuse or link drawn blown, a breaker drawn tripped. */
	blown?: boolean;
};

const f = (n: number) => String(Math.round(n * 100) / 100);
const line = (x1: number, y1: number, x2: number, y2: number, cls = 'sp-body') =>
	`<line class="${cls}" x1="${f(x1)}" y1="${f(y1)}" x2="${f(x2)}" y2="${f(y2)}"/>`;
const rect = (x: number, y: number, w: number, h: number, cls = 'sp-body') =>
	`<rect class="${cls}" x="${f(x)}" y="${f(y)}" width="${f(w)}" height="${f(h)}"/>`;
const circle = (cx: number, cy: number, r: number, cls = 'sp-body') =>
	`<circle class="${cls}" cx="${f(cx)}" cy="${f(cy)}" r="${f(r)}"/>`;
const path = (d: string, cls = 'sp-body') => `<path class="${cls}" d="${d}"/>`;
const text = (x: number, y: number, s: string, cls = 'sp-pin', anchor = 'start') =>
	`<text class="${cls}" x="${f(x)}" y="${f(y)}" text-anchor="${anchor}">${escapeXml(s)}</text>`;

export function escapeXml(s: string): string {
	return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** Two-pin symbols: pin on top at (10, 0), bottom at (10, 60); the body draws between y 10 and 50. */
function twoPinBody(type: PartType, part: DiagramPart, topIsSecond: boolean, setting: string | null, blown = false): string {
	const leads = line(10, 0, 10, 12) + line(10, 48, 10, 60);
	// A blown element: the conductor broken in the middle, with a cross over the gap.
	const broken = line(10, 0, 10, 24) + line(10, 36, 10, 60) + line(6, 26, 14, 34, 'sp-body sp-thin') + line(14, 26, 6, 34, 'sp-body sp-thin');
	switch (type) {
		case 'fuse':
			return blown ? broken + rect(5, 14, 10, 32) : line(10, 0, 10, 60) + rect(5, 14, 10, 32);
		case 'fusible-link':
			if (blown) return broken + rect(5, 14, 10, 32, 'sp-body sp-soft');
			return (
				line(10, 0, 10, 14) +
				line(10, 46, 10, 60) +
				rect(5, 14, 10, 32, 'sp-body sp-soft') +
				path('M10 14 L10 20 L13 23 L7 27 L13 31 L7 35 L13 39 L10 42 L10 46')
			);
		case 'breaker':
			return (
				line(10, 0, 10, 16) +
				line(10, 44, 10, 60) +
				circle(10, 16, 2, 'sp-fill') +
				circle(10, 44, 2, 'sp-fill') +
				(blown ? path('M10 16 C 24 20, 26 30, 22 36') : path('M10 16 C 22 22, 22 38, 10 44')) +
				line(14, 30, 20, 30) +
				line(20, 27, 20, 33)
			);
		case 'lamp':
			return (
				line(10, 0, 10, 20) +
				line(10, 40, 10, 60) +
				circle(10, 30, 10) +
				line(3, 23, 17, 37) +
				line(17, 23, 3, 37)
			);
		case 'motor':
			return (
				line(10, 0, 10, 20) +
				line(10, 40, 10, 60) +
				circle(10, 30, 10) +
				text(10, 34.5, 'M', 'sp-sym-text', 'middle')
			);
		case 'horn':
			return (
				line(10, 0, 10, 22) +
				line(10, 38, 10, 60) +
				rect(4, 22, 8, 16) +
				path('M12 25 L19 17 L19 43 L12 35')
			);
		case 'heater':
			return (
				line(10, 0, 10, 14) +
				line(10, 46, 10, 60) +
				rect(3, 14, 14, 32) +
				path('M10 14 L10 18 L15 18 L15 24 L5 24 L5 30 L15 30 L15 36 L5 36 L5 42 L10 42 L10 46')
			);
		case 'resistor':
			return (
				line(10, 0, 10, 14) +
				line(10, 46, 10, 60) +
				path('M10 14 L16 17 L4 23 L16 29 L4 35 L16 41 L10 46')
			);
		case 'solenoid':
			return (
				line(10, 0, 10, 14) +
				line(10, 46, 10, 60) +
				path('M10 14 A 4 4 0 0 0 10 22 A 4 4 0 0 0 10 30 A 4 4 0 0 0 10 38 A 4 4 0 0 0 10 46') +
				rect(13, 18, 5, 24, 'sp-fill')
			);
		case 'supply':
			return (
				line(10, 0, 10, 26) +
				line(10, 34, 10, 60) +
				line(0, 26, 20, 26) +
				line(5, 34, 15, 34, 'sp-body sp-thick') +
				text(17, 21, '+', 'sp-pin', 'middle') +
				text(17, 44, '−', 'sp-pin', 'middle')
			);
		case 'diode': {
			// a on top unless the layout put k on top; the triangle points from a to k.
			const down = !topIsSecond;
			const led = (part.drop ?? 0.7) >= 1.5;
			const tri = down ? 'M2 22 L18 22 L10 38 Z' : 'M2 38 L18 38 L10 22 Z';
			const bar = down ? line(2, 38, 18, 38) : line(2, 22, 18, 22);
			const arrows = led
				? path('M14 28 L20 24 M20 24 L17 24 M20 24 L20 27', 'sp-body sp-thin') +
					path('M15 33 L21 29 M21 29 L18 29 M21 29 L21 32', 'sp-body sp-thin')
				: '';
			return line(10, 0, 10, 22) + line(10, 38, 10, 60) + path(tri) + bar + arrows;
		}
		case 'switch': {
			const closed = (setting ?? part.normally ?? 'open') === 'closed';
			const blade = closed ? line(10, 14, 10, 46, 'sp-body sp-thick') : line(10, 14, 19, 42, 'sp-body sp-thick');
			return (
				line(10, 0, 10, 14) +
				line(10, 46, 10, 60) +
				circle(10, 14, 2, 'sp-fill') +
				circle(10, 46, 2, 'sp-fill') +
				blade
			);
		}
		default:
			return leads + rect(4, 12, 12, 36);
	}
}

/** Builds the symbol of a part, with the given pins on top. */
export function buildSymbol(part: DiagramPart, opts: SymbolOptions): SymbolShape {
	const pitch = Math.max(opts.pitch, 4 * GRID);
	switch (part.type) {
		case 'splice':
			return {
				w: 10,
				h: 10,
				pins: { [part.id]: { x: 5, y: 5, exit: 'any' } },
				body: circle(5, 5, 4, 'sp-fill'),
				laneX: [5],
				subs: []
			};
		case 'ground':
			return {
				w: 20,
				h: 30,
				pins: { [part.id]: { x: 10, y: 0, exit: 'up' } },
				body: groundBody(),
				laneX: [10],
				subs: []
			};
		case 'relay':
			return relaySymbol(part, opts, pitch);
		case 'connector':
			return connectorSymbol(part, opts, pitch);
		case 'switch':
			if (part.positions) return positionedSwitch(part, opts);
		// falls through: a single-throw switch is a two-pin symbol
		default: {
			const [p1, p2] = listPins(part);
			const topIsSecond = opts.top.has(p2) && !opts.top.has(p1);
			const top = topIsSecond ? p2 : p1;
			const bottom = topIsSecond ? p1 : p2;
			return {
				w: 20,
				h: 60,
				pins: { [top]: { x: 10, y: 0, exit: 'up' }, [bottom]: { x: 10, y: 60, exit: 'down' } },
				body: twoPinBody(part.type, part, topIsSecond, opts.setting ?? null, Boolean(opts.blown)),
				laneX: [10],
				subs: []
			};
		}
	}
}

export function groundBody(): string {
	return line(10, 0, 10, 14) + line(0, 14, 20, 14) + line(4, 19, 16, 19) + line(8, 24, 12, 24);
}

function relaySymbol(part: DiagramPart, opts: SymbolOptions, pitch: number): SymbolShape {
	const coilTop = opts.top.has('85') && !opts.top.has('86') ? '85' : '86';
	const coilBottom = coilTop === '86' ? '85' : '86';
	const cx = 10;
	const kx = 10 + pitch;
	const w = kx + 30;
	const h = 60;
	const energized = Boolean(opts.energized);
	const bladeEnd = energized ? [kx + 1, 43] : [kx + 19, 43];
	const body =
		rect(1, 12, w - 2, 36, 'sp-body sp-dash sp-thin') +
		// coil: 86/85 leads and a winding box with a diagonal stroke
		line(cx, 0, cx, 20) +
		line(cx, 40, cx, 60) +
		rect(cx - 7, 20, 14, 20) +
		line(cx - 7, 40, cx + 7, 20) +
		text(cx + 3, 9, coilTop) +
		text(cx + 3, 58, coilBottom) +
		// contacts: 30 common, 87 normally open, 87a normally closed
		line(kx, 0, kx, 16) +
		circle(kx, 16, 2, 'sp-fill') +
		line(kx, 44, kx, 60) +
		line(kx - 4, 44, kx + 4, 44) +
		line(kx + 20, 44, kx + 20, 60) +
		line(kx + 16, 44, kx + 24, 44) +
		line(kx, 16, bladeEnd[0], bladeEnd[1], 'sp-body sp-thick') +
		line(cx + 7, 30, kx + (energized ? 0 : 9), 30, 'sp-body sp-dash sp-thin') +
		text(kx + 3, 9, '30') +
		text(kx + 3, 58, '87') +
		text(kx + 23, 58, '87a');
	return {
		w,
		h,
		pins: {
			[coilTop]: { x: cx, y: 0, exit: 'up' },
			[coilBottom]: { x: cx, y: 60, exit: 'down' },
			'30': { x: kx, y: 0, exit: 'up' },
			'87': { x: kx, y: 60, exit: 'down' },
			'87a': { x: kx + 20, y: 60, exit: 'down' }
		},
		body,
		laneX: [cx, kx],
		subs: [
			{ id: `${part.id}.coil`, x: 0, y: 0, w: cx + 10, h },
			{ id: `${part.id}.contact`, x: kx - 10, y: 0, w: 40, h }
		]
	};
}

function connectorSymbol(part: DiagramPart, opts: SymbolOptions, pitch: number): SymbolShape {
	const lanes = listLanes(part);
	const topSide = opts.top.has('1b') && !opts.top.has('1a') ? 'b' : 'a';
	const bottomSide = topSide === 'a' ? 'b' : 'a';
	const n = lanes.length;
	const w = (n - 1) * pitch + 20;
	const pins: Record<string, SymbolPin> = {};
	const subs: SubBox[] = [];
	let body = rect(0, 12, w, 17) + rect(0, 31, w, 17);
	const laneX: number[] = [];
	for (let i = 0; i < n; i++) {
		const x = 10 + i * pitch;
		const cav = i + 1;
		laneX.push(x);
		pins[`${cav}${topSide}`] = { x, y: 0, exit: 'up' };
		pins[`${cav}${bottomSide}`] = { x, y: 60, exit: 'down' };
		body +=
			line(x, 0, x, 24) +
			path(`M${x - 3} 21 L${x} 25 L${x + 3} 21`, 'sp-body sp-thin') +
			line(x, 35, x, 60) +
			path(`M${x - 3} 35 L${x} 31 L${x + 3} 35`, 'sp-body sp-thin') +
			text(x + 4, 45, String(cav));
		subs.push({ id: `${part.id}.${cav}`, x: x - 10, y: 0, w: 20, h: 60 });
	}
	return { w, h: 60, pins, body, laneX, subs };
}

function positionedSwitch(part: DiagramPart, opts: SymbolOptions): SymbolShape {
	const positions = part.positions ?? {};
	const all = positionPins(positions);
	const top = all.filter((p) => opts.top.has(p));
	const bottom = all.filter((p) => !opts.top.has(p));
	const STEP = 30;
	const cols = Math.max(top.length, bottom.length, 1);
	const w = (cols - 1) * STEP + 30;
	const pins: Record<string, SymbolPin> = {};
	const xy: Record<string, [number, number]> = {};
	// Commons centred over the outputs, so the wiper reads as one pole throwing to several contacts.
	const offset = (n: number) => ((cols - n) * STEP) / 2;
	top.forEach((p, i) => {
		const x = 10 + Math.round((offset(top.length) + i * STEP) / GRID) * GRID;
		pins[p] = { x, y: 0, exit: 'up' };
		xy[p] = [x, 17];
	});
	bottom.forEach((p, i) => {
		const x = 10 + i * STEP;
		pins[p] = { x, y: 60, exit: 'down' };
		xy[p] = [x, 43];
	});
	const names = Object.keys(positions);
	const current = opts.setting && positions[opts.setting] ? opts.setting : names[0];
	let body = rect(1, 10, w - 2, 40, 'sp-body sp-dash sp-thin');
	for (const p of all) {
		const [x, y] = xy[p];
		const atTop = pins[p].y === 0;
		body += line(x, pins[p].y, x, y) + circle(x, y, 2.2, 'sp-fill') + text(x + 3, atTop ? 8 : 59, p);
	}
	for (const [a, b] of positions[current] ?? []) {
		const [x1, y1] = xy[a];
		const [x2, y2] = xy[b];
		body += line(x1, y1, x2, y2, 'sp-body sp-thick');
	}
	return { w, h: 60, pins, body, laneX: [pins[top[0] ?? all[0]]?.x ?? 10], subs: [] };
}

/** A small drawing of each part type for the legend: footprint 20 × 60 or its own size. */
export function legendSymbol(type: PartType, led = false): SymbolShape {
	const sample: DiagramPart = { id: 'X', type, drop: led ? 2 : undefined, cavities: 1 };
	if (type === 'switch') sample.normally = 'open';
	return buildSymbol(sample, { top: new Set(['1', '86', '30', 'a', '+', '1a']), pitch: 40 });
}
