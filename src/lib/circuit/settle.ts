/**
 * The spec's settling loop: starting fresh (fuses intact, relays released, diodes blocking), solve,
 * then flip the first disagreeing diode, else update the first disagreeing relay (with chattering by
 * the repeat-history rule), else open the most overloaded fuse, and solve again, until nothing changes.
 */
import { makeWork, solveLinear, elementAmps, type Config, type Work } from './mna';
import type { Net } from './netlist';
import { MAX_SETTLE_STEPS } from './tables';

/** One change made while settling, kept for explanations. Volts in V, amps in A. */
export type SettleEvent =
	| { kind: 'diode'; id: string; to: 'conducting' | 'blocking'; volts: number; amps: number }
	| { kind: 'relay'; id: string; to: 'energized' | 'released'; coilVolts: number }
	| { kind: 'chattering'; ids: string[] }
	| { kind: 'fuse'; id: string; amps: number; rating: number };

/** Settling choices from what-if options: relays held in a state (by relay index), and whether fuses may open. */
export type SettleOptions = { forced?: Map<number, 0 | 1>; noFuseOpens?: boolean; record?: boolean };

/** The outcome of settling: the final configuration and solution, or the source of a dead short. */
export type Settled = { net: Net; cfg: Config; work: Work; dead: boolean; events: SettleEvent[] };

/** The relay states as one number, base 3, relay 0 in the lowest digit. */
function relayCode(relay: Int8Array): number {
	let k = 0;
	for (let r = relay.length - 1; r >= 0; r--) k = k * 3 + relay[r];
	return k;
}

/** One set of solve buffers per compiled network, reused by the next settle of that network. */
const pooled = new WeakMap<Net, Work>();

/** Solve buffers for transient networks, by node count (a solve replaces every other array of a Work). */
const transientPool = new Map<number, Work>();

function transientWork(net: Net): Work {
	let w = transientPool.get(net.nNodes);
	if (!w) transientPool.set(net.nNodes, (w = makeWork(net)));
	return w;
}

/** Settles a compiled network (its buffers are reused by the next settle of the same network, so read results first). Never throws for a network built from a valid circuit. */
export function settle(net: Net, opts: SettleOptions = {}, work?: Work): Settled {
	let w = work ?? (net.transient ? transientWork(net) : pooled.get(net));
	if (!w) pooled.set(net, (w = makeWork(net)));
	const nr = net.relayPart.length;
	const cfg: Config = {
		fuseOpen: new Uint8Array(net.fuses.length),
		relay: new Int8Array(nr),
		diodeOn: new Uint8Array(net.diodes.length)
	};
	const forced = opts.forced;
	const held = new Uint8Array(nr);
	for (let r = 0; r < nr; r++) {
		if (net.relayDead[r]) held[r] = 1;
		const fr = forced?.get(r);
		if (fr !== undefined) {
			cfg.relay[r] = fr;
			held[r] = 1;
		}
	}
	const events: SettleEvent[] = [];
	const rec = !!opts.record;
	let history: number[] = [relayCode(cfg.relay)];
	const V = w.V;
	const ids = net.els;
	for (let step = 0; step < MAX_SETTLE_STEPS; step++) {
		if (!solveLinear(net, cfg, w)) return { net, cfg, work: w, dead: true, events };
		// diodes, first in file order
		let changed = false;
		for (let d = 0; d < net.diodes.length; d++) {
			const e = net.diodes[d];
			if (cfg.diodeOn[d]) {
				const amps = elementAmps(net, w, e);
				if (Math.round(amps * 1e4) < 0) {
					cfg.diodeOn[d] = 0;
					if (rec) events.push({ kind: 'diode', id: ids[e].id, to: 'blocking', volts: V[net.ea[e]] - V[net.eb[e]], amps });
					changed = true;
					break;
				}
			} else {
				const mv = Math.round(V[net.ea[e]] * 1000) - Math.round(V[net.eb[e]] * 1000);
				if (mv > Math.round(net.ev[e] * 1000)) {
					cfg.diodeOn[d] = 1;
					if (rec) events.push({ kind: 'diode', id: ids[e].id, to: 'conducting', volts: mv / 1000, amps: 0 });
					changed = true;
					break;
				}
			}
		}
		if (changed) continue;
		// relays, first in file order
		for (let r = 0; r < nr; r++) {
			if (held[r] || cfg.relay[r] === 2) continue;
			const mv = Math.abs(Math.round(V[net.relay86[r]] * 1000) - Math.round(V[net.relay85[r]] * 1000));
			const s = cfg.relay[r];
			const want = s === 0 ? (mv >= net.pullInMv[r] ? 1 : 0) : mv < net.dropOutMv[r] ? 0 : 1;
			if (want === s) continue;
			cfg.relay[r] = want;
			const id = net.circuit.parts[net.relayPart[r]].id;
			if (rec) events.push({ kind: 'relay', id, to: want ? 'energized' : 'released', coilVolts: mv / 1000 });
			const code = relayCode(cfg.relay);
			const seen = history.indexOf(code);
			if (seen >= 0) {
				const chat: string[] = [];
				for (let q = 0; q < nr; q++) {
					let p3 = 1;
					for (let t = 0; t < q; t++) p3 *= 3;
					const digit = (k: number) => Math.floor(k / p3) % 3;
					const first = digit(history[seen]);
					let flips = false;
					for (let h = seen + 1; h < history.length; h++) if (digit(history[h]) !== first) flips = true;
					if (flips) {
						cfg.relay[q] = 2;
						chat.push(net.circuit.parts[net.relayPart[q]].id);
					}
				}
				if (rec) events.push({ kind: 'chattering', ids: chat });
			}
			history.push(relayCode(cfg.relay));
			changed = true;
			break;
		}
		if (changed) continue;
		// fuses: the one intact fuse with the largest |I| / amps above 1 (ties: file order)
		if (!opts.noFuseOpens) {
			let best = -1;
			let bestRatio = 1;
			let bestAmps = 0;
			for (let k = 0; k < net.fuses.length; k++) {
				if (cfg.fuseOpen[k]) continue;
				const amps = Math.round(Math.abs(elementAmps(net, w, net.fuses[k])) * 1e4) / 1e4;
				const ratio = amps / net.fuseRating[k];
				if (ratio > bestRatio) {
					bestRatio = ratio;
					best = k;
					bestAmps = amps;
				}
			}
			if (best >= 0) {
				cfg.fuseOpen[best] = 1;
				if (rec) events.push({ kind: 'fuse', id: ids[net.fuses[best]].id, amps: bestAmps, rating: net.fuseRating[best] });
				history = [relayCode(cfg.relay)];
				continue;
			}
		}
		break;
	}
	return { net, cfg, work: w, dead: false, events };
}
