import { beforeAll, describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { MATRIX, type Allowed, type MatrixEntry, type Visitor } from '../authz-matrix';
import { discoverRoutes, type DiscoveredRoute } from '../helpers/routes';
import { demoAccount, request, signIn, type Reply } from '../helpers/app';
import { ROLES, type Role } from '../../src/lib/server/auth/roles';

const VISITORS: Visitor[] = ['anonymous', ...ROLES];

const keyOf = (r: DiscoveredRoute | MatrixEntry) =>
	r.kind === 'page' ? `page ${r.route}` : r.kind === 'action' ? `action ${r.route} ?/${r.action}` : `${r.method} ${r.route}`;

function allows(allow: Allowed, visitor: Visitor): boolean {
	if (allow === 'anyone') return true;
	if (allow === 'signed-in') return visitor !== 'anonymous';
	return visitor !== 'anonymous' && allow.includes(visitor);
}

describe('the authorization matrix (tests/authz-matrix.ts)', () => {
	const discovered = discoverRoutes().map(keyOf);
	const listed = MATRIX.map(keyOf);

	it('lists every page, form action and API method under src/routes', () => {
		expect(discovered.filter((k) => !listed.includes(k)), 'routes missing from tests/authz-matrix.ts').toEqual([]);
	});

	it('lists nothing that is not under src/routes', () => {
		expect(listed.filter((k) => !discovered.includes(k)), 'matrix entries without a route').toEqual([]);
		expect(new Set(listed).size).toBe(listed.length);
	});
});

describe('every matrix entry over HTTP, for an anonymous visitor and each role', () => {
	const cookies = new Map<Visitor, string | null>([['anonymous', null]]);
	const userIds = {} as Record<Role, string>;

	beforeAll(async () => {
		for (const role of ROLES) {
			const cookie = await signIn(demoAccount(role).email);
			cookies.set(role, cookie);
			const me = await request('/api/me', { cookie });
			userIds[role] = (JSON.parse(me.body) as { id: string }).id;
		}
	});

	async function exercise(entry: MatrixEntry, visitor: Visitor): Promise<Reply> {
		let cookie = cookies.get(visitor) ?? null;
		const path = entry.path ?? entry.route;
		if (entry.kind === 'action') {
			if (entry.endsSession && visitor !== 'anonymous') cookie = await signIn(demoAccount(visitor).email);
			const form = entry.form({ visitor, userIds, unique: `${visitor}-${randomBytes(4).toString('hex')}` });
			const target = entry.action === 'default' ? path : `${path}?/${entry.action}`;
			return request(target, { cookie, form });
		}
		return request(path, { cookie, method: entry.kind === 'endpoint' ? entry.method : 'GET' });
	}

	for (const entry of MATRIX) {
		for (const visitor of VISITORS) {
			const allowed = allows(entry.allow, visitor);
			it(`${keyOf(entry)} as ${visitor}: ${allowed ? 'allowed' : 'refused'}`, async () => {
				const reply = await exercise(entry, visitor);
				const where = `${reply.status} ${reply.location ?? ''} ${reply.status >= 400 ? reply.body.slice(0, 300) : ''}`;
				if (allowed) {
					const outcome = entry.outcome ?? { status: 200 };
					if ('status' in outcome) {
						expect(reply.status, where).toBe(outcome.status);
					} else {
						expect(reply.status, where).toBe(303);
						expect(new URL(reply.location ?? '', 'http://x').pathname, where).toBe(outcome.redirect);
					}
				} else if (visitor === 'anonymous') {
					expect(reply.status, where).toBe(303);
					expect(reply.location ?? '', where).toMatch(/^\/signin\?next=/);
				} else {
					expect(reply.status, where).toBe(403);
				}
			});
		}
	}
});
