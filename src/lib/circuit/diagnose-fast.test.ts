/**
 * The diagnosis's fast path (faulted circuits built once and uncached, networks compiled for one use,
 * solve structures in one shared slot, observations checked most-discriminating first) against the
 * straightforward one: `applyFault` on a separately parsed circuit, then `solveCircuit` /
 * `solveDetailed` from scratch. Over every golden circuit's standard fault list and every state, the
 * results must be identical (unrounded volts bit for bit), and `diagnose` must give the candidates
 * and next test that the spec's rule (circuit-format.md, "Diagnosis") gives on the straightforward
 * solves.
 */
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { parse } from 'yaml';
import { applyFault, faultedCircuit, formatFault, standardFaults, type Fault } from './faults';
import { compileTransient } from './netlist';
import { buildResult, voltsByName } from './results';
import { settle } from './settle';
import { diagnose, parseCircuit, solveCircuit, solveDetailed, type Diagnosis, type Observation, type SolveResult } from './index';
import { LOAD_TYPES } from './model';

const GOLDEN_DIR = fileURLToPath(new URL('./golden/', import.meta.url));
const golden = readdirSync(GOLDEN_DIR)
	.filter((f) => f.endsWith('.yaml'))
	.sort()
	.map((file) => ({ file, text: (parse(readFileSync(join(GOLDEN_DIR, file), 'utf8')) as { circuit: string }).circuit }));

/** Equal minimum-norm tie rule of the engine's next test: a later option wins only when strictly better. */
const TIE_EPS = 1e-12;
const OUTCOME_ORDER = ['supply', 'ground', 'partial', 'floating', 'dead-short'];

type Straight = SolveResult | null; // null = dead short

/** Straightforward solves of every fault (none first) in every state, on a circuit parsed for this alone. */
function straightSolves(text: string): { faults: (Fault | null)[]; states: string[]; r: Straight[][] } {
	const c = parseCircuit(text);
	const faults = [null, ...standardFaults(c)];
	const states = c.states.map((s) => s.name);
	const r = faults.map((f) =>
		states.map((state) => {
			const x = solveCircuit(c, { state, fault: f ?? undefined });
			return 'error' in x ? null : x;
		})
	);
	return { faults, states, r };
}

/** The spec's diagnosis computed from straightforward solves. */
function referenceDiagnosis(s: ReturnType<typeof straightSolves>, points: string[], obs: Observation[]): Diagnosis {
	const fits = (r: Straight, o: Observation) =>
		!!r && Object.entries(o.parts).every(([id, st]) => r.parts[id].status === st) && Object.entries(o.points).every(([id, rd]) => r.points[id].reads === rd);
	const cand = s.faults.map((_, fi) => fi).filter((fi) => obs.every((o) => fits(s.r[fi][s.states.indexOf(o.state)], o)));
	const names = cand.map((fi) => (s.faults[fi] ? formatFault(s.faults[fi]!) : 'none'));
	if (cand.length < 2) return { candidates: names, next_test: null };
	let best: Diagnosis['next_test'] = null;
	s.states.forEach((state, si) => {
		for (const pt of points) {
			const groups: Record<string, string[]> = {};
			cand.forEach((fi, k) => {
				const r = s.r[fi][si];
				(groups[r ? r.points[pt].reads : 'dead-short'] ??= []).push(names[k]);
			});
			const left = Object.values(groups).reduce((a, g) => a + g.length * g.length, 0) / cand.length;
			if (!best || left < best.expected_left - TIE_EPS) {
				const outcomes: Record<string, string[]> = {};
				for (const k of OUTCOME_ORDER) if (groups[k]) outcomes[k] = groups[k];
				best = { state, point: pt, expected_left: left, outcomes };
			}
		}
	});
	return { candidates: names, next_test: best };
}

/** What a technician could observe with fault `fi` in place: every load, relay and fuse status and every point, in `states`. */
function observationsOf(text: string, r: Straight[], states: string[], sparse: boolean): Observation[] {
	const c = parseCircuit(text);
	const out: Observation[] = [];
	states.forEach((state, si) => {
		const x = r[si];
		if (!x) return;
		const parts: Record<string, string> = {};
		for (const p of c.parts)
			if (LOAD_TYPES.has(p.type) || p.type === 'relay' || p.type === 'fuse' || p.type === 'breaker') parts[p.id] = x.parts[p.id].status!;
		const points: Observation['points'] = {};
		for (const pt of c.points) points[pt.label] = x.points[pt.label].reads;
		if (sparse) {
			const first = Object.keys(points)[0];
			out.push({ state, parts: {}, points: first ? { [first]: points[first] } : {} });
		} else out.push({ state, parts, points });
	});
	return out.filter((o) => Object.keys(o.parts).length + Object.keys(o.points).length > 0);
}

describe('fast diagnosis path gives the straightforward answers', () => {
	for (const { file, text } of golden) {
		it(`${file}: every standard fault in every state, fast solve = applyFault + solve from scratch`, () => {
			const c = parseCircuit(text);
			const fresh = parseCircuit(text);
			const faults = [null, ...standardFaults(c)];
			let compared = 0;
			for (const f of faults) {
				const fc = f ? faultedCircuit(c, f) : c;
				const sc = f ? applyFault(fresh, f) : fresh;
				expect(fc.elements).toEqual(sc.elements);
				for (const st of c.states) {
					const s = settle(compileTransient(fc, st.name, null));
					const fast = s.dead ? null : { result: buildResult(s, fc.fault, true), volts: voltsByName(s) };
					const slow = solveDetailed(fresh, { state: st.name, fault: f ?? undefined });
					if ('error' in slow.result) expect(fast, `${f ? formatFault(f) : 'none'} in ${st.name}`).toBeNull();
					else {
						expect(fast, `${f ? formatFault(f) : 'none'} in ${st.name}`).not.toBeNull();
						expect(fast!.result).toEqual(slow.result);
						expect(fast!.volts).toEqual(slow.volts);
					}
					compared++;
				}
			}
			expect(compared).toBe(faults.length * c.states.length);
		});

		it(`${file}: diagnose = the spec's rule on straightforward solves`, () => {
			const s = straightSolves(text);
			if (s.states.length === 0) return;
			const points = parseCircuit(text).points.map((p) => p.label);
			// the circuit as it is and a spread of faults, each observed fully and sparsely
			const step = Math.max(1, Math.floor(s.faults.length / 5));
			let checked = 0;
			for (let fi = 0; fi < s.faults.length; fi += step) {
				for (const sparse of [false, true]) {
					const obs = observationsOf(text, s.r[fi], s.states, sparse);
					if (obs.length === 0) continue;
					const got = diagnose(parseCircuit(text), obs);
					expect(got, `${s.faults[fi] ? formatFault(s.faults[fi]!) : 'none'}${sparse ? ' (sparse)' : ''}`).toEqual(referenceDiagnosis(s, points, obs));
					checked++;
				}
			}
			expect(checked).toBeGreaterThan(0);
		});
	}
});
