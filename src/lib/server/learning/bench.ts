/**
 * The virtual bench: circuits to probe, and "find the fault" challenges whose fault stays on the server.
 * A challenge's readings are solved here with the hidden fault; the score compares the readings the
 * learner used with the number of tests the engine's next-best-test strategy (`diagnose`) needs.
 */
import { randomBytes } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { and, eq } from 'drizzle-orm';
import { diagnose, formatFault, parseFault, solveCircuit, standardFaults, type Circuit, type Observation } from '$lib/circuit';
import { readDiagramCircuit } from '$lib/diagram';
import type { Db } from '../db/client';
import { benchChallenge, item, itemVersion } from '../db/schema';
import { CIRCUITS_DIR } from '../content/circuits';
import { LearnError } from './errors';

const LOADS = new Set(['lamp', 'motor', 'horn', 'heater', 'solenoid']);
const DEMO_RE = /^[a-z0-9][a-z0-9-]{0,80}$/;
const ITEM_RE = /^i\.(\d{1,12})$/;

export type BenchCircuit = { ref: string; title: string; text: string; engine: Circuit };

/** Reads a bench circuit: a demo file stem (`horn-relay`) or a published item's circuit (`i.VERSION_ID`). */
export async function benchCircuit(db: Db, ref: string): Promise<BenchCircuit | null> {
	let text: string | null = null;
	const m = ITEM_RE.exec(ref);
	if (m) {
		const [r] = await db
			.select({ text: itemVersion.circuitText })
			.from(itemVersion)
			.innerJoin(item, eq(item.publishedVersionId, itemVersion.id))
			.where(and(eq(itemVersion.id, Number(m[1])), eq(item.status, 'published')));
		text = r?.text ?? null;
	} else if (DEMO_RE.test(ref)) {
		text = await readFile(path.join(CIRCUITS_DIR, `${ref}.yaml`), 'utf8').catch(() => null);
	}
	if (!text) return null;
	try {
		const { circuit, diagram } = readDiagramCircuit(text);
		return { ref, title: diagram.title, text, engine: circuit };
	} catch {
		return null;
	}
}

/** The demo circuits and a sample of circuits from published items, for the bench's list. */
export async function benchList(db: Db): Promise<{ ref: string; title: string; source: 'demo' | 'item' }[]> {
	const { readdir } = await import('node:fs/promises');
	const out: { ref: string; title: string; source: 'demo' | 'item' }[] = [];
	for (const f of (await readdir(CIRCUITS_DIR).catch(() => [] as string[])).filter((n) => n.endsWith('.yaml')).sort()) {
		const c = await benchCircuit(db, f.replace(/\.yaml$/, ''));
		if (c) out.push({ ref: c.ref, title: c.title, source: 'demo' });
	}
	const rows = await db
		.select({ id: itemVersion.id, ref: itemVersion.circuitRef, text: itemVersion.circuitText })
		.from(item)
		.innerJoin(itemVersion, eq(itemVersion.id, item.publishedVersionId))
		.where(eq(item.status, 'published'))
		.limit(400);
	const seen = new Set<string>();
	for (const r of rows) {
		if (seen.has(r.text) || r.ref.startsWith('content/circuits/')) continue;
		seen.add(r.text);
		try {
			out.push({ ref: `i.${r.id}`, title: readDiagramCircuit(r.text).diagram.title, source: 'item' });
		} catch {
			// A circuit the diagram cannot draw is left off the bench list.
		}
		if (out.filter((o) => o.source === 'item').length >= 24) break;
	}
	return out;
}

const statesOf = (c: Circuit) => c.states.map((s) => s.name);

/** What the customer notices: each load's status in each state, under the fault. */
export function complaintOf(c: Circuit, fault: string | null): Observation[] {
	return statesOf(c).map((state) => {
		const r = solveCircuit(c, { state, fault });
		const parts: Record<string, string> = {};
		for (const p of c.parts) if (LOADS.has(p.type)) parts[p.id] = 'error' in r ? 'off' : (r.parts[p.id]?.status ?? 'off');
		return { state, parts, points: {} };
	});
}

/** Faults of the standard list that change what a customer notices (the others could not be found from a complaint). */
export function noticeableFaults(c: Circuit): string[] {
	const normal = JSON.stringify(complaintOf(c, null));
	return standardFaults(c)
		.map(formatFault)
		.filter((f) => {
			try {
				return JSON.stringify(complaintOf(c, f)) !== normal;
			} catch {
				return false;
			}
		});
}

/** Creates a challenge: a chosen fault (authors and instructors) or one drawn at random from the standard list. */
export async function createChallenge(db: Db, user: { id: string; roles: string[] }, ref: string, fault: string | null): Promise<string> {
	const c = await benchCircuit(db, ref);
	if (!c) throw new LearnError('unknown_circuit', `There is no bench circuit "${ref}". Pick one from the bench list.`, 404, { circuit: 'unknown circuit' });
	if (statesOf(c.engine).length === 0) throw new LearnError('no_states', 'This circuit has no named states, so a fault cannot be found from a complaint. Pick another circuit.', 400, { circuit: 'no states' });
	const faults = noticeableFaults(c.engine);
	let chosen: string;
	if (fault) {
		if (!user.roles.some((r) => r === 'author' || r === 'instructor')) throw new LearnError('not_allowed', 'Only authors and instructors choose the fault; leave it empty for a random one.', 403, { fault: 'not allowed' });
		let f: string;
		try {
			f = formatFault(parseFault(fault));
		} catch {
			throw new LearnError('bad_fault', `"${fault}" is not a fault: write KIND:TARGET, e.g. open:W3.`, 400, { fault: 'not a fault' });
		}
		if (!faults.includes(f)) throw new LearnError('bad_fault', `"${fault}" is not a fault of this circuit that a customer would notice. Pick one from the list.`, 400, { fault: 'not in the list' });
		chosen = f;
	} else {
		if (faults.length === 0) throw new LearnError('no_faults', 'No standard fault of this circuit shows in its loads. Pick another circuit.', 400);
		chosen = faults[randomBytes(4).readUInt32BE(0) % faults.length];
	}
	const id = randomBytes(12).toString('base64url').slice(0, 16);
	await db.insert(benchChallenge).values({ id, circuitRef: ref, fault: chosen, createdBy: user.id });
	return id;
}

export type ChallengeView = { id: string; circuitRef: string; title: string; circuitText: string; complaint: Observation[]; faults: string[]; states: string[]; points: string[] };

/** What the learner sees of a challenge: the circuit, the complaint and the list of faults to choose from (never which one). */
export async function challengeView(db: Db, id: string): Promise<ChallengeView | null> {
	const [ch] = await db.select().from(benchChallenge).where(eq(benchChallenge.id, id));
	if (!ch) return null;
	const c = await benchCircuit(db, ch.circuitRef);
	if (!c) return null;
	return {
		id,
		circuitRef: ch.circuitRef,
		title: c.title,
		circuitText: c.text,
		complaint: complaintOf(c.engine, ch.fault),
		faults: noticeableFaults(c.engine),
		states: statesOf(c.engine),
		points: Object.keys(readDiagramCircuit(c.text).diagram.points)
	};
}

async function loadChallenge(db: Db, id: string) {
	const [ch] = await db.select().from(benchChallenge).where(eq(benchChallenge.id, id));
	const c = ch ? await benchCircuit(db, ch.circuitRef) : null;
	if (!ch || !c) throw new LearnError('unknown_challenge', 'This bench challenge does not exist. Ask for a new link, or start one from the bench.', 404, { challengeId: 'unknown' });
	return { ch, c };
}

/** A meter reading with the hidden fault: red lead on `red`, black on `black` (a point, GND or B+), in `state`. */
export async function challengeReading(db: Db, req: { challengeId: string; state: string; red: string; black: string }) {
	const { ch, c } = await loadChallenge(db, req.challengeId);
	if (!statesOf(c.engine).includes(req.state)) throw new LearnError('bad_state', `"${req.state}" is not a state of this circuit.`, 400, { state: 'unknown state' });
	const r = solveCircuit(c.engine, { state: req.state, fault: ch.fault });
	if ('error' in r) return { state: req.state, red: req.red, black: req.black, volts: null, note: 'Dead short: the fuse side of the circuit cannot be read.' };
	const at = (p: string) => (p === 'GND' ? 0 : p === 'B+' ? (r.nodes['B+'] ?? null) : (r.points[p]?.volts ?? null));
	const a = at(req.red);
	const b = at(req.black);
	if (a === null) throw new LearnError('bad_point', `"${req.red}" is not a test point of this circuit.`, 400, { red: 'unknown point' });
	if (b === null) throw new LearnError('bad_point', `"${req.black}" is not a test point of this circuit.`, 400, { black: 'unknown point' });
	return { state: req.state, red: req.red, black: req.black, volts: Math.round((a - b) * 1000) / 1000, note: null };
}

/**
 * The number of readings the engine's strategy takes: diagnose's next best test, read under the fault,
 * until one candidate is left or a reading no longer narrows them (the rest cannot be told apart).
 */
export function engineTests(c: Circuit, fault: string): number {
	const obs = complaintOf(c, fault);
	let left = Infinity;
	for (let n = 0; n < 12; n++) {
		const d = diagnose(c, obs);
		if (d.candidates.length <= 1 || !d.next_test || d.candidates.length >= left) return n;
		left = d.candidates.length;
		const { state, point } = d.next_test;
		const r = solveCircuit(c, { state, fault });
		if ('error' in r) return n + 1;
		const o = obs.find((x) => x.state === state)!;
		o.points[point] = r.points[point].reads;
	}
	return 12;
}

/** True when two faults look the same on the bench: the same load statuses and point volts (to 0.01 V) in every state. */
export function sameSymptoms(c: Circuit, a: string, b: string): boolean {
	const look = (f: string) =>
		JSON.stringify(
			statesOf(c).map((state) => {
				const r = solveCircuit(c, { state, fault: f });
				if ('error' in r) return 'dead short';
				return [Object.entries(r.parts).filter(([id]) => c.parts.find((p) => p.id === id && LOADS.has(p.type))).map(([id, p]) => `${id}=${p.status}`), Object.entries(r.points).map(([id, p]) => `${id}=${p.volts.toFixed(2)}`)];
			})
		);
	return look(a) === look(b);
}

/** Scores a named fault: right or wrong, the hidden fault, and the readings used against the engine's. */
export async function judgeGuess(db: Db, req: { challengeId: string; fault: string; readings: number }) {
	const { ch, c } = await loadChallenge(db, req.challengeId);
	let named: string;
	try {
		named = formatFault(parseFault(req.fault));
	} catch {
		throw new LearnError('bad_fault', `"${req.fault}" is not a fault: pick one from the list.`, 400, { fault: 'not a fault' });
	}
	// A fault that no reading on the bench can tell from the hidden one counts as found.
	const correct = named === ch.fault || sameSymptoms(c.engine, named, ch.fault);
	const engine = engineTests(c.engine, ch.fault);
	const used = Math.max(0, req.readings);
	const efficiency = used === 0 ? 1 : Math.min(1, Math.max(engine, 1) / used);
	return { correct, fault: ch.fault, named, readingsUsed: used, engineReadings: engine, score: correct ? Math.round(efficiency * 100) / 100 : 0 };
}
