// Bench challenges against the real MariaDB: the hidden fault stays on the server, readings use it,
// only authors and instructors choose it.
import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { readFileSync } from 'node:fs';
import { closeDb, getDb } from '../db/client';
import { benchChallenge } from '../db/schema';
import { solveCircuit } from '$lib/circuit';
import { readDiagramCircuit } from '$lib/diagram';
import { createAccount } from '../users/accounts';
import { uniqueEmail } from '../../../../tests/helpers/db';
import { challengeReading, challengeView, createChallenge, judgeGuess } from './bench';

afterAll(closeDb);

const { circuit } = readDiagramCircuit(readFileSync('content/circuits/horn-relay.yaml', 'utf8'));

async function person(role: 'learner' | 'author') {
	const u = await createAccount({ email: uniqueEmail(`bench-${role}`), name: 'Ada Pellworth', password: 'a long test password', timeZone: 'UTC', roles: [role] });
	return { id: u.id, roles: [role] };
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
			const r = await challengeReading(getDb(), { challengeId: id, state, red: point, black: 'GND' });
			const direct = solveCircuit(circuit, { state, fault: row.fault });
			if ('error' in direct) expect(r.volts).toBeNull();
			else expect(r.volts).toBeCloseTo(direct.points[point].volts, 3);
		}
		const right = await judgeGuess(getDb(), { challengeId: id, fault: row.fault, readings: 3 });
		expect(right.correct).toBe(true);
		expect(right.fault).toBe(row.fault);
		const wrongFault = view!.faults.find((f) => f !== row.fault && JSON.stringify(solveCircuit(circuit, { state, fault: f })) !== JSON.stringify(solveCircuit(circuit, { state, fault: row.fault })));
		if (wrongFault) expect((await judgeGuess(getDb(), { challengeId: id, fault: wrongFault, readings: 3 })).correct).toBe(false);
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
});
