// Who may use what: every page, form action and API method under src/routes, written by hand.
// tests/app/authz.test.ts discovers the routes from the file system and fails on anything missing here,
// then exercises every entry over HTTP for an anonymous visitor and for each role.
// Adding a route? Add its entries here (see DEVELOPERS.md, "Adding a route").
import type { Role } from '../src/lib/server/auth/roles';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../src/lib/server/seed/demo';
import { BANK_ROUTES } from './authz-matrix-bank';
import { DIAGRAM_ROUTES } from './authz-matrix-diagram';
import { LEARNING_ROUTES } from './authz-matrix-learning';

export type Visitor = 'anonymous' | Role;

/** 'anyone' includes anonymous visitors; 'signed-in' is any account; a list means those roles only. */
export type Allowed = 'anyone' | 'signed-in' | Role[];

/**
 * What an allowed visitor gets: a 200, a 303 to this path (compared without the query), or, for a JSON
 * endpoint exercised without a body, the 400 of its input check (it got past the guard).
 */
export type Outcome = { status: 200 | 400 } | { redirect: string };

/** Facts a form may need, e.g. the demo accounts' user ids. */
export type FormContext = { visitor: Visitor; userIds: Record<Role, string>; unique: string };

export type MatrixEntry =
	| { kind: 'page'; route: string; path?: string; allow: Allowed; outcome?: Outcome }
	| {
			kind: 'action';
			route: string;
			action: string;
			path?: string;
			allow: Allowed;
			form: (ctx: FormContext) => Record<string, string>;
			outcome: Outcome;
			/** The action ends the visitor's session (signing out, or signing in anew), so it gets a session of its own. */
			endsSession?: boolean;
	  }
	| { kind: 'endpoint'; route: string; method: string; path?: string; allow: Allowed; outcome?: Outcome };

export const MATRIX: MatrixEntry[] = [
	{ kind: 'page', route: '/', allow: 'anyone' },
	{ kind: 'page', route: '/signin', allow: 'anyone' },
	{
		kind: 'action',
		route: '/signin',
		action: 'default',
		allow: 'anyone',
		form: () => ({ email: 'reviewer@harrowcreek.example', password: DEMO_PASSWORD, next: '/home' }),
		outcome: { redirect: '/home' },
		endsSession: true
	},
	{ kind: 'page', route: '/signup', allow: 'anyone' },
	{
		kind: 'action',
		route: '/signup',
		action: 'default',
		allow: 'anyone',
		form: ({ unique }) => ({
			name: 'Matrix Visitor',
			email: `matrix-${unique}@harrowcreek.example`,
			password: 'a matrix of long words',
			timeZone: 'UTC'
		}),
		outcome: { redirect: '/home' },
		endsSession: true
	},
	{ kind: 'page', route: '/signout', allow: 'anyone' },
	{
		kind: 'action',
		route: '/signout',
		action: 'default',
		allow: 'anyone',
		form: () => ({}),
		outcome: { redirect: '/' },
		endsSession: true
	},
	{ kind: 'page', route: '/home', allow: 'signed-in' },
	{ kind: 'page', route: '/profile', allow: 'signed-in' },
	{
		kind: 'action',
		route: '/profile',
		action: 'default',
		allow: 'signed-in',
		form: ({ visitor }) => ({
			name: DEMO_ACCOUNTS.find((a) => a.role === visitor)?.name ?? 'Nobody',
			timeZone: 'America/Chicago'
		}),
		outcome: { redirect: '/profile' }
	},
	{ kind: 'page', route: '/admin/users', allow: ['site_admin'] },
	{
		kind: 'action',
		route: '/admin/users',
		action: 'grant',
		allow: ['site_admin'],
		form: ({ userIds }) => ({ userId: userIds.learner, role: 'reviewer' }),
		outcome: { redirect: '/admin/users' }
	},
	{
		kind: 'action',
		route: '/admin/users',
		action: 'revoke',
		allow: ['site_admin'],
		form: ({ userIds }) => ({ userId: userIds.learner, role: 'reviewer' }),
		outcome: { redirect: '/admin/users' }
	},
	{ kind: 'endpoint', route: '/api/health', method: 'GET', allow: 'anyone' },
	{ kind: 'endpoint', route: '/api/me', method: 'GET', allow: 'signed-in' },
	// Each area keeps its routes in a file of its own, so that engineers adding routes do not collide.
	...DIAGRAM_ROUTES,
	...BANK_ROUTES,
	...LEARNING_ROUTES
];
