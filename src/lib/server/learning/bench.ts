/**
 * The virtual bench: circuits to probe, and "find the fault" challenges whose fault stays on the server.
 * A challenge's readings are solved here with the hidden fault and recorded per person (`bench_attempt`);
 * the score compares the readings recorded with the number of tests the engine's next-best-test
 * strategy (`diagnose`) needs. Nothing the client says about its readings is read.
 */
import { randomBytes } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { and, eq, inArray, notLike, sql } from 'drizzle-orm';
import { diagnose, formatFault, parseFault, solveCircuit, standardFaults, type Circuit, type Observation } from '$lib/circuit';
import { readDiagramCircuit } from '$lib/diagram';
import { cautionsFor } from '$lib/items/blueprint';
import type { Db } from '../db/client';
import { benchAttempt, benchChallenge, item, itemVersion } from '../db/schema';
import { CIRCUITS_DIR } from '../content/circuits';
import { LearnError } from './errors';
import type { Tx } from './q';

const LOADS = new Set(['lamp', 'motor', 'horn', 'heater', 'solenoid']);
const DEMO_RE = /^[a-z0-9][a-z0-9-]{0,80}$/;
const ITEM_RE = /^i\.(\d{1,12})$/;

export type BenchCaution = { id: string; text: string };
export type BenchCircuit = { ref: string; title: string; text: string; engine: Circuit; cautions: BenchCaution[] };

/**
 * Safety cautions for taking readings on a circuit: a bank circuit's item carries its own; a workshop file
 * gets those of what it shows (a battery, starter or charging circuit; an airbag squib loop; hybrid high
 * voltage), as the bank gives an item that asks for a test (blueprint.ts cautionsFor).
 */
export function benchCautions(c: Circuit, title: string, ref: string): BenchCaution[] {
	const words = `${ref} ${title} ${c.id}`.toLowerCase();
	const tags: string[] = [];
	if (/battery|starter|starting|charging|generator|alternator/.test(words)) tags.push('battery');
	if (/airbag|squib/.test(words)) tags.push('airbag');
	if (/hybrid|high.voltage/.test(words)) tags.push('high-voltage');
	return cautionsFor('', 'next-test', tags).map((x) => ({ id: x.id, text: x.text }));
}

/** Reads a bench circuit: a demo file stem (`horn-relay`) or a published item's circuit (`i.VERSION_ID`). */
export async function benchCircuit(db: Db, ref: string): Promise<BenchCircuit | null> {
	let text: string | null = null;
	let stored: BenchCaution[] | null = null;
	const m = ITEM_RE.exec(ref);
	if (m) {
		const [r] = await db
			.select({ text: itemVersion.circuitText, cautions: itemVersion.cautions })
			.from(itemVersion)
			.innerJoin(item, eq(item.publishedVersionId, itemVersion.id))
			.where(and(eq(itemVersion.id, Number(m[1])), eq(item.status, 'published')));
		text = r?.text ?? null;
		stored = ((r?.cautions as BenchCaution[] | null | undefined) ?? []).map((x) => ({ id: x.id, text: x.text }));
	} else if (DEMO_RE.test(ref)) {
		text = await readFile(path.join(CIRCUITS_DIR, `${ref}.yaml`), 'utf8').catch(() => null);
	}
	if (!text) return null;
	try {
		const { circuit, diagram } = readDiagramCircuit(text);
		// An item's own cautions when it has any; otherwise those of what the circuit shows.
		const cautions = stored?.length ? stored : benchCautions(circuit, diagram.title, ref);
		return { ref, title: diagram.title, text, engine: circuit, cautions };
	} catch {
		return null;
	}
}

export type BenchListEntry = { ref: string; title: string; source: 'demo' | 'item'; versions: number };

/**
 * The demo circuits, then one circuit per circuit source of the published items (a generator family's
 * variants share a title, so the list shows each family once, with how many versions of it the bank has,
 * and opens its first published version).
 */
export async function benchList(db: Db): Promise<BenchListEntry[]> {
	const { readdir } = await import('node:fs/promises');
	const out: BenchListEntry[] = [];
	for (const f of (await readdir(CIRCUITS_DIR).catch(() => [] as string[])).filter((n) => n.endsWith('.yaml')).sort()) {
		const c = await benchCircuit(db, f.replace(/\.yaml$/, ''));
		if (c) out.push({ ref: c.ref, title: c.title, source: 'demo', versions: 1 });
	}
	const groups = await db
		.select({ ref: itemVersion.circuitRef, first: sql<number>`min(${itemVersion.id})`, versions: sql<number>`count(distinct ${itemVersion.circuitText})` })
		.from(item)
		.innerJoin(itemVersion, eq(itemVersion.id, item.publishedVersionId))
		.where(and(eq(item.status, 'published'), notLike(itemVersion.circuitRef, 'content/circuits/%')))
		.groupBy(itemVersion.circuitRef)
		.orderBy(itemVersion.circuitRef)
		.limit(60);
	if (!groups.length) return out;
	const texts = await db
		.select({ id: itemVersion.id, text: itemVersion.circuitText })
		.from(itemVersion)
		.where(inArray(itemVersion.id, groups.map((g) => Number(g.first))));
	const textOf = new Map(texts.map((t) => [t.id, t.text]));
	const items: BenchListEntry[] = [];
	for (const g of groups) {
		const text = textOf.get(Number(g.first));
		if (!text) continue;
		try {
			items.push({ ref: `i.${Number(g.first)}`, title: readDiagramCircuit(text).diagram.title, source: 'item', versions: Number(g.versions) });
		} catch {
			// A circuit the diagram cannot draw is left off the bench list.
		}
	}
	items.sort((a, b) => a.title.localeCompare(b.title, 'en') || a.ref.localeCompare(b.ref));
	return [...out, ...items];
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

export type BenchReading = { state: string; red: string; black: string; volts: number | null; note: string | null };
export type BenchVerdict = { correct: boolean; fault: string; named: string; readingsUsed: number; engineReadings: number; score: number };

export type ChallengeView = {
	id: string;
	circuitRef: string;
	title: string;
	cautions: BenchCaution[];
	circuitText: string;
	complaint: Observation[];
	faults: string[];
	states: string[];
	points: string[];
	/** The viewer's attempt so far: the readings recorded and, once named, the verdict (a reload resumes it). */
	attempt: { readings: BenchReading[]; verdict: BenchVerdict | null };
};

/** One recorded reading: where the leads were, in which state; `key` is the client's idempotency key when it sent one. */
type ReadingKey = { state: string; red: string; black: string; key?: string };
type AttemptRow = typeof benchAttempt.$inferSelect;

/** What the learner sees of a challenge: the circuit, the complaint and the list of faults to choose from (never which one). */
export async function challengeView(db: Db, id: string, userId: string | null = null): Promise<ChallengeView | null> {
	const [ch] = await db.select().from(benchChallenge).where(eq(benchChallenge.id, id));
	if (!ch) return null;
	const c = await benchCircuit(db, ch.circuitRef);
	if (!c) return null;
	const [attempt] = userId ? await db.select().from(benchAttempt).where(and(eq(benchAttempt.challengeId, id), eq(benchAttempt.userId, userId))) : [];
	return {
		id,
		circuitRef: ch.circuitRef,
		title: c.title,
		circuitText: c.text,
		cautions: c.cautions,
		complaint: complaintOf(c.engine, ch.fault),
		faults: noticeableFaults(c.engine),
		states: statesOf(c.engine),
		points: Object.keys(readDiagramCircuit(c.text).diagram.points),
		attempt: {
			readings: attempt ? (attempt.readings as ReadingKey[]).map((k) => readMeter(c.engine, ch.fault, k)) : [],
			verdict: (attempt?.result as BenchVerdict | null | undefined) ?? null
		}
	};
}

async function loadChallenge(db: Db, id: string) {
	const [ch] = await db.select().from(benchChallenge).where(eq(benchChallenge.id, id));
	const c = ch ? await benchCircuit(db, ch.circuitRef) : null;
	if (!ch || !c) throw new LearnError('unknown_challenge', 'This bench challenge does not exist. Ask for a new link, or start one from the bench.', 404, { challengeId: 'unknown' });
	return { ch, c };
}

/** The meter between `red` and `black` (a point, GND or B+) in `state` under `fault`; throws a LearnError naming a bad state or point. */
function readMeter(c: Circuit, fault: string, req: ReadingKey): BenchReading {
	if (!statesOf(c).includes(req.state)) throw new LearnError('bad_state', `"${req.state}" is not a state of this circuit. Pick one from the list.`, 400, { state: 'unknown state' });
	const r = solveCircuit(c, { state: req.state, fault });
	const known = (p: string) => p === 'GND' || p === 'B+' || c.points.some((x) => x.label === p);
	if (!known(req.red)) throw new LearnError('bad_point', `"${req.red}" is not a test point of this circuit. Pick one from the list.`, 400, { red: 'unknown point' });
	if (!known(req.black)) throw new LearnError('bad_point', `"${req.black}" is not a test point of this circuit. Pick one from the list.`, 400, { black: 'unknown point' });
	if ('error' in r) return { state: req.state, red: req.red, black: req.black, volts: null, note: 'Dead short: the fuse side of the circuit cannot be read.' };
	const at = (p: string) => (p === 'GND' ? 0 : p === 'B+' ? (r.nodes['B+'] ?? null) : (r.points[p]?.volts ?? null));
	const a = at(req.red);
	const b = at(req.black);
	if (a === null) throw new LearnError('bad_point', `"${req.red}" cannot be read in this circuit. Pick another point.`, 400, { red: 'unreadable point' });
	if (b === null) throw new LearnError('bad_point', `"${req.black}" cannot be read in this circuit. Pick another point.`, 400, { black: 'unreadable point' });
	return { state: req.state, red: req.red, black: req.black, volts: Math.round((a - b) * 1000) / 1000, note: null };
}

/** The person's attempt row, created empty on first use and locked for the rest of the transaction. */
async function lockAttempt(tx: Tx, challengeId: string, userId: string): Promise<AttemptRow> {
	await tx.insert(benchAttempt).ignore().values({ challengeId, userId, readings: [] });
	const [a] = await tx.select().from(benchAttempt).where(and(eq(benchAttempt.challengeId, challengeId), eq(benchAttempt.userId, userId))).for('update');
	return a!;
}

/** Readings one attempt may record; past this the learner is asked to name the fault. */
export const MAX_READINGS = 200;

/**
 * A meter reading with the hidden fault: red lead on `red`, black on `black` (a point, GND or B+), in
 * `state`. Every reading is recorded on the person's attempt (a repeat counts again: it is another
 * reading taken); readings after the fault has been named are shown but no longer recorded.
 * `readingsTaken` is the attempt's count.
 */
export async function challengeReading(
	db: Db,
	userId: string,
	req: { challengeId: string; state: string; red: string; black: string; idempotencyKey?: string }
): Promise<BenchReading & { readingsTaken: number }> {
	const { ch, c } = await loadChallenge(db, req.challengeId);
	const key: ReadingKey = { state: req.state, red: req.red, black: req.black, ...(req.idempotencyKey ? { key: req.idempotencyKey } : {}) };
	const reading = readMeter(c.engine, ch.fault, key);
	const taken = await db.transaction(async (tx) => {
		const a = await lockAttempt(tx, ch.id, userId);
		const list = a.readings as ReadingKey[];
		if (a.result) return list.length;
		// A retried request (the reply was lost) carries the same key: it was counted already.
		if (key.key && list.some((r) => r.key === key.key)) return list.length;
		if (list.length >= MAX_READINGS) throw new LearnError('too_many_readings', `You have taken ${MAX_READINGS} readings on this challenge. Name the fault now to see how you did.`, 409);
		await tx.update(benchAttempt).set({ readings: [...list, key] }).where(and(eq(benchAttempt.challengeId, ch.id), eq(benchAttempt.userId, userId)));
		return list.length + 1;
	});
	return { ...reading, readingsTaken: taken };
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

/**
 * Scores a named fault: right or wrong, the hidden fault, and the readings recorded on the person's
 * attempt against the engine's. The first fault named is final: naming again returns the same verdict.
 */
export async function judgeGuess(db: Db, userId: string, req: { challengeId: string; fault: string }): Promise<BenchVerdict> {
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
	return db.transaction(async (tx) => {
		const a = await lockAttempt(tx, ch.id, userId);
		if (a.result) return a.result as BenchVerdict;
		const used = (a.readings as ReadingKey[]).length;
		const efficiency = used === 0 ? 1 : Math.min(1, Math.max(engine, 1) / used);
		const verdict: BenchVerdict = { correct, fault: ch.fault, named, readingsUsed: used, engineReadings: engine, score: correct ? Math.round(efficiency * 100) / 100 : 0 };
		await tx.update(benchAttempt).set({ result: verdict, finishedAt: new Date() }).where(and(eq(benchAttempt.challengeId, ch.id), eq(benchAttempt.userId, userId)));
		return verdict;
	});
}
