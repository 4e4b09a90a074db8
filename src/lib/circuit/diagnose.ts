/**
 * Diagnosis: which faults of the standard list reproduce the observations, and which labelled point
 * in which state splits those candidates best (least expected candidates left, Σ nᵢ² / N).
 */
import { ObservationError } from './errors';
import { faultedCircuit, formatFault, standardFaults } from './faults';
import { FUSE_TYPES, LOAD_TYPES, type Circuit, type Part } from './model';
import { compileTransient } from './netlist';
import { partState, readingClass, reachSets } from './results';
import { settle, type Settled } from './settle';
import type { Diagnosis, Observation, Reads } from './types';
import { findRoot } from './union-find';

/** Statuses a part can be observed in, or null when it has none. */
export function statusesOf(p: Part): string[] | null {
	if (p.type === 'breaker') return ['ok', 'tripped'];
	if (FUSE_TYPES.has(p.type)) return ['ok', 'blown'];
	if (p.type === 'relay') return ['energized', 'released', 'chattering'];
	if (p.type === 'switch') return p.positions ? p.positions.map((x) => x.name) : ['open', 'closed'];
	if (LOAD_TYPES.has(p.type)) return ['on', 'weak', 'off'];
	if (p.type === 'diode') return ['conducting', 'blocking'];
	return null;
}

/** Checks observations against a circuit. @throws ObservationError naming the missing state, part, point or status. */
export function checkObservations(c: Circuit, observations: Observation[]): void {
	for (const o of observations) {
		if (!c.states.some((s) => s.name === o.state))
			throw new ObservationError(`unknown state "${o.state}"; this circuit's states are ${c.states.map((s) => s.name).join(', ') || 'none'}`);
		for (const [id, st] of Object.entries(o.parts)) {
			const p = c.parts.find((x) => x.id === id);
			if (!p) {
				const isPoint = c.points.some((x) => x.label === id);
				throw new ObservationError(
					isPoint ? `point ${id} reads one of supply, ground, partial, floating, not "${st}"` : `unknown part "${id}" in state ${o.state}`
				);
			}
			const allowed = statusesOf(p);
			if (!allowed) throw new ObservationError(`${id} is a ${p.type}, which has no status to observe`);
			if (!allowed.includes(st)) throw new ObservationError(`${id} (a ${p.type}) has no status "${st}"; use one of ${allowed.join(', ')}`);
		}
		for (const id of Object.keys(o.points))
			if (!c.points.some((x) => x.label === id)) throw new ObservationError(`unknown point "${id}" in state ${o.state}; points: ${c.points.map((x) => x.label).join(', ')}`);
	}
}

/** What a diagnosis keeps of one settled solve: part statuses and point reading classes; null = dead short. */
type Outcome = { parts: Record<string, string | null>; points: Record<string, Reads> } | null;

function matches(r: Outcome, o: Observation): boolean {
	if (!r) return false;
	for (const id in o.parts) if (r.parts[id] !== o.parts[id]) return false;
	for (const id in o.points) if (r.points[id] !== o.points[id]) return false;
	return true;
}

/** Statuses and reading classes of a settled solve, as `buildResult` reports them. */
function readOutcome(s: Settled): Outcome {
	if (s.dead) return null;
	const c = s.net.circuit;
	const parts: Record<string, string | null> = {};
	for (let pi = 0; pi < c.parts.length; pi++) parts[c.parts[pi].id] = partState(s, pi, null).status;
	const points: Record<string, Reads> = {};
	if (c.points.length) {
		const reach = reachSets(s);
		for (let q = 0; q < c.points.length; q++) {
			const node = s.net.pointNode[q];
			points[c.points[q].label] = readingClass(s.work.V[node], s.net.emf, reach.live[findRoot(reach.p, node)] === 1);
		}
	}
	return { parts, points };
}

const OUTCOME_ORDER = ['supply', 'ground', 'partial', 'floating', 'dead-short'];

/**
 * Candidates reproducing every observation (`none` first when the fault-free circuit does, then the
 * standard list in order; a dead short reproduces nothing) and the next best test: the labelled point
 * and state minimising Σ nᵢ² / N over its reading classes (ties: state order, then point order);
 * null when fewer than two candidates remain. Outcomes list the candidates by reading class
 * (`dead-short` for a candidate that is a dead short in that state).
 * @throws ObservationError for observations that do not fit the circuit.
 */
export function diagnose(c: Circuit, observations: Observation[]): Diagnosis {
	checkObservations(c, observations);
	const faults = [null, ...standardFaults(c)];
	const stateNames = c.states.map((s) => s.name);
	// readings kept per fault and state, only for faults still in the running (the next test needs them)
	const cache = new Map<string, Outcome>();
	// each faulted circuit is built once per diagnosis and compiled for one use per state (nothing is
	// cached beyond this call); the answers are those of applyFault then a solve from scratch
	let lastFi = -1;
	let lastFc: Circuit = c;
	const circuitOf = (fi: number): Circuit => {
		if (fi !== lastFi) {
			const f = faults[fi];
			lastFc = f ? faultedCircuit(c, f) : c;
			lastFi = fi;
		}
		return lastFc;
	};
	const outcome = (fi: number, state: string): Outcome => {
		const key = `${fi}|${state}`;
		const known = cache.get(key);
		if (known !== undefined) return known;
		const fc = circuitOf(fi);
		const r = readOutcome(settle(compileTransient(fc, state, null)));
		cache.set(key, r);
		return r;
	};
	// statuses and readings only for what was observed, solved once per fault and state
	const partIdx = new Map(c.parts.map((p, i) => [p.id, i]));
	const pointIdx = new Map(c.points.map((p, i) => [p.label, i]));
	const matchesNow = (s: Settled, o: Observation): boolean => {
		if (s.dead) return false;
		for (const id in o.parts) if (partState(s, partIdx.get(id)!, null).status !== o.parts[id]) return false;
		let reach: { p: Int32Array; live: Uint8Array } | null = null;
		for (const id in o.points) {
			const node = s.net.pointNode[pointIdx.get(id)!];
			reach ??= reachSets(s);
			if (readingClass(s.work.V[node], s.net.emf, reach.live[findRoot(reach.p, node)] === 1) !== o.points[id]) return false;
		}
		return true;
	};
	// A fault is a candidate when it reproduces every observation, so the order in which they are
	// checked does not change the set. The observation that has ruled out the most faults so far is
	// checked first (ties: the order given), so most faults are dropped after one settle.
	const order = observations.map((_, j) => j);
	const ruledOut = new Int32Array(observations.length);
	const cand: number[] = [];
	for (let fi = 0; fi < faults.length; fi++) {
		let ok = true;
		for (const j of order) {
			const o = observations[j];
			const key = `${fi}|${o.state}`;
			const known = cache.get(key);
			if (known !== undefined) {
				if (!matches(known, o)) ok = false;
			} else {
				const fc = circuitOf(fi);
				const s = settle(compileTransient(fc, o.state, null));
				if (!matchesNow(s, o)) ok = false;
				// a fault still in the running is looked at again for the next test: keep its readings
				else cache.set(key, readOutcome(s));
			}
			if (!ok) {
				ruledOut[j]++;
				break;
			}
		}
		if (ok) cand.push(fi);
		else order.sort((x, y) => ruledOut[y] - ruledOut[x] || x - y);
	}
	const names = cand.map((fi) => (faults[fi] ? formatFault(faults[fi]!) : 'none'));
	if (cand.length < 2) return { candidates: names, next_test: null };
	let best: Diagnosis['next_test'] = null;
	const N = cand.length;
	// readings of every candidate in every state (fault by fault, so each faulted circuit is built once)
	const rsByState: Outcome[][] = stateNames.map(() => new Array<Outcome>(N));
	cand.forEach((fi, k) => stateNames.forEach((state, si) => (rsByState[si][k] = outcome(fi, state))));
	for (let si = 0; si < stateNames.length; si++) {
		const state = stateNames[si];
		const rs = rsByState[si];
		for (const pt of c.points) {
			const groups = new Map<string, string[]>();
			rs.forEach((r, k) => {
				const cls = r ? r.points[pt.label] : 'dead-short';
				let g = groups.get(cls);
				if (!g) groups.set(cls, (g = []));
				g.push(names[k]);
			});
			let sum = 0;
			for (const g of groups.values()) sum += g.length * g.length;
			const expected = sum / N;
			if (!best || expected < best.expected_left - 1e-12) {
				const outcomes: Record<string, string[]> = {};
				for (const k of OUTCOME_ORDER) if (groups.has(k)) outcomes[k] = groups.get(k)!;
				best = { state, point: pt.label, expected_left: expected, outcomes };
			}
		}
	}
	return { candidates: names, next_test: best };
}
