// Bench challenges against the real MariaDB: the hidden fault stays on the server, readings use it,
// only authors and instructors choose it.
import { afterAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import type { RequestEvent } from '@sveltejs/kit';
import { readFileSync } from 'node:fs';
import { randomUUID } from 'node:crypto';
import { closeDb, getDb } from '../db/client';
import { benchAttempt, benchChallenge } from '../db/schema';
import { solveCircuit } from '$lib/circuit';
import { readDiagramCircuit } from '$lib/diagram';
import { createAccount } from '../users/accounts';
import { uniqueEmail } from '../../../../tests/helpers/db';
import { challengeReading, challengeView, createChallenge, judgeGuess, sameSymptoms } from './bench';
import { POST as guessRoute } from '../../../routes/api/bench/guess/+server';

afterAll(closeDb);

const { circuit } = readDiagramCircuit(readFileSync('content/circuits/horn-relay.yaml', 'utf8'));

async function person(role: 'learner' | 'author') {
	const u = await createAccount({ email: uniqueEmail(`bench-${role}`), name: 'Ada Pellworth', password: 'a long test password', timeZone: 'UTC', roles: [role] });
	return { id: u.id, roles: [role] };
}

/** POST /api/bench/guess as `who`, through the route's own body check. */
async function postGuess(who: { id: string; roles: string[] }, body: unknown) {
	const url = new URL('http://127.0.0.1/api/bench/guess');
	const request = new Request(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
	const event = { request, url, locals: { user: { id: who.id, roles: who.roles, name: 'Ada Pellworth', email: 'x@harrowcreek.example' } } } as unknown as RequestEvent;
	const res = await guessRoute(event as Parameters<typeof guessRoute>[0]);
	return { status: res.status, body: await res.json() };
}

describe('bench challenges', () => {
	it('keep the hidden fault on the server and solve readings with it', async () => {
		const learner = await person('learner');
		const id = await createChallenge(getDb(), learner, 'horn-relay', null);
		const [row] = await getDb().select().from(benchChallenge).where(eq(benchChallenge.id, id));
		const view = await challengeView(getDb(), id);
		expect(view).not.toBeNull();
		expect(Object.keys(view!)).not.toContain('fault');
		expect(view!.faults).toContain(row.fault);
		const state = view!.states[view!.states.length - 1];
		for (const point of view!.points) {
			const r = await challengeReading(getDb(), learner.id, { challengeId: id, state, red: point, black: 'GND' });
			const direct = solveCircuit(circuit, { state, fault: row.fault });
			if ('error' in direct) expect(r.volts).toBeNull();
			else expect(r.volts).toBeCloseTo(direct.points[point].volts, 3);
		}
		const right = await judgeGuess(getDb(), learner.id, { challengeId: id, fault: row.fault });
		expect(right.correct).toBe(true);
		expect(right.fault).toBe(row.fault);
		// Another person on the same challenge (a shared link) has an attempt of their own.
		const other = await person('learner');
		// A fault the bench can tell apart from the hidden one (by the judge's own rule, sameSymptoms) is wrong.
		const wrongFault = view!.faults.find((f) => f !== row.fault && !sameSymptoms(circuit, f, row.fault));
		expect(wrongFault, 'the horn relay has faults the bench tells apart').toBeDefined();
		expect((await judgeGuess(getDb(), other.id, { challengeId: id, fault: wrongFault! })).correct).toBe(false);
	});

	it('let authors choose the fault and refuse a learner who tries', async () => {
		const author = await person('author');
		const learner = await person('learner');
		const id = await createChallenge(getDb(), author, 'horn-relay', 'open:H1');
		const [row] = await getDb().select().from(benchChallenge).where(eq(benchChallenge.id, id));
		expect(row.fault).toBe('open:H1');
		await expect(createChallenge(getDb(), learner, 'horn-relay', 'open:H1')).rejects.toMatchObject({ code: 'not_allowed', status: 403 });
		await expect(createChallenge(getDb(), author, 'no-such-circuit', null)).rejects.toMatchObject({ code: 'unknown_circuit' });
		await expect(createChallenge(getDb(), author, 'horn-relay', 'melted:H1')).rejects.toMatchObject({ code: 'bad_fault' });
	});

	it('score the readings the server recorded; a forged count in the guess body changes nothing', async () => {
		const author = await person('author');
		const id = await createChallenge(getDb(), author, 'horn-relay', 'open:H1');
		const view = (await challengeView(getDb(), id))!;
		const state = view.states[view.states.length - 1];
		const take = (who: { id: string }, red: string) => challengeReading(getDb(), who.id, { challengeId: id, state, red, black: 'GND' });
		// Three readings taken here, one of them a repeat (another reading all the same).
		const honest = await person('learner');
		const forger = await person('learner');
		for (const who of [honest, forger]) {
			expect((await take(who, view.points[0])).readingsTaken).toBe(1);
			expect((await take(who, view.points[1])).readingsTaken).toBe(2);
			expect((await take(who, view.points[0])).readingsTaken).toBe(3);
		}
		const a = await postGuess(honest, { challengeId: id, fault: 'open:H1' });
		const b = await postGuess(forger, { challengeId: id, fault: 'open:H1', readings: 0 });
		expect(a.status).toBe(200);
		expect(b.status).toBe(200);
		expect(a.body.readingsUsed).toBe(3);
		expect(b.body).toEqual(a.body);
		// The first fault named is final: a second try, with another forged count, returns the same verdict.
		expect(await postGuess(forger, { challengeId: id, fault: 'open:H1', readings: 1 })).toEqual(b);
		expect(await judgeGuess(getDb(), forger.id, { challengeId: id, fault: view.faults.find((f) => f !== 'open:H1')! })).toEqual(b.body);
		// Readings after the verdict are shown but not recorded.
		expect((await take(forger, view.points[1])).readingsTaken).toBe(3);
		const [row] = await getDb().select().from(benchAttempt).where(and(eq(benchAttempt.challengeId, id), eq(benchAttempt.userId, forger.id)));
		expect(row.readings).toHaveLength(3);
		// A reload gets the attempt back: the three readings and the verdict.
		const again = (await challengeView(getDb(), id, forger.id))!;
		expect(again.attempt.readings.map((r) => r.red)).toEqual([view.points[0], view.points[1], view.points[0]]);
		expect(again.attempt.verdict).toEqual(b.body);
		// A body of the wrong shape is a 400 naming the field, not a stack trace.
		const bad = await postGuess(honest, { challengeId: id, fault: 'open:H1', readings: -4 });
		expect(bad.status).toBe(400);
		expect(bad.body.error.fields).toHaveProperty('readings');
	});

	it('count a retried reading once: the same idempotency key is one reading, a new key another', async () => {
		const learner = await person('learner');
		const id = await createChallenge(getDb(), learner, 'horn-relay', null);
		const view = (await challengeView(getDb(), id))!;
		const state = view.states[0];
		const key = randomUUID();
		const first = await challengeReading(getDb(), learner.id, { challengeId: id, state, red: view.points[0], black: 'GND', idempotencyKey: key });
		// The reply was lost and the client sent the same request again.
		const retry = await challengeReading(getDb(), learner.id, { challengeId: id, state, red: view.points[0], black: 'GND', idempotencyKey: key });
		expect(first.readingsTaken).toBe(1);
		expect(retry).toEqual(first);
		const next = await challengeReading(getDb(), learner.id, { challengeId: id, state, red: view.points[0], black: 'GND', idempotencyKey: randomUUID() });
		expect(next.readingsTaken).toBe(2);
		const [row] = await getDb().select().from(benchAttempt).where(and(eq(benchAttempt.challengeId, id), eq(benchAttempt.userId, learner.id)));
		expect(row.readings).toHaveLength(2);
	});
});
