import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { closeDb } from '../db/client';
import { createAccount } from './accounts';
import { searchPeople } from './directory';

afterAll(closeDb);

const tag = `dir${randomBytes(3).toString('hex')}`;

beforeAll(async () => {
	for (let i = 0; i < 25; i++) {
		await createAccount({
			email: `${tag}-${String(i).padStart(2, '0')}@harrowcreek.example`,
			name: i === 7 ? `Wendeline ${tag}` : `Person ${i}`,
			password: 'harness connector C104',
			timeZone: 'UTC',
			roles: i % 2 ? ['learner'] : []
		});
	}
});

describe('searchPeople (MariaDB)', () => {
	it('finds by part of the e-mail, one page at a time, ordered by e-mail', async () => {
		const first = await searchPeople(tag, 1, 10);
		expect(first.total).toBe(25);
		expect(first.pages).toBe(3);
		expect(first.people.map((p) => p.email)[0]).toBe(`${tag}-00@harrowcreek.example`);
		const last = await searchPeople(tag, 3, 10);
		expect(last.people).toHaveLength(5);
		expect(last.people.at(-1)?.email).toBe(`${tag}-24@harrowcreek.example`);
		expect(last.people[0]?.roles).toEqual([]);
		expect(last.people[1]?.roles).toEqual(['learner']);
	});

	it('finds by name', async () => {
		const found = await searchPeople(`Wendeline ${tag}`, 1);
		expect(found.people.map((p) => p.email)).toEqual([`${tag}-07@harrowcreek.example`]);
	});

	it('treats % and _ in the search as plain characters', async () => {
		expect((await searchPeople(`${tag}%`, 1)).total).toBe(0);
		expect((await searchPeople(`${tag}_0`, 1)).total).toBe(0);
	});

	it('clamps a page past the end to the last page', async () => {
		const result = await searchPeople(tag, 99, 10);
		expect(result.page).toBe(3);
	});
});
