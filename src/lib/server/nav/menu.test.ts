import { describe, expect, it } from 'vitest';
import { menuFor } from './menu';

// Each person sees only what their roles allow (the route guards enforce the same; see tests/authz-matrix.ts).
describe('menuFor', () => {
	it('shows nothing to an anonymous visitor', () => expect(menuFor(null)).toEqual([]));

	it('shows a learner their own pages only', () => {
		expect(menuFor(['learner']).map((m) => m.href)).toEqual(['/home', '/learn', '/progress', '/exam', '/bench', '/profile']);
	});

	it('adds people and roles for a site admin', () => {
		expect(menuFor(['learner', 'site_admin']).map((m) => m.href)).toEqual(['/home', '/learn', '/progress', '/exam', '/bench', '/profile', '/gallery', '/admin/users']);
	});

	it('shows the circuit gallery to the roles that write, vouch for or teach with items', () => {
		for (const role of ['author', 'reviewer', 'instructor', 'site_admin'] as const) expect(menuFor([role]).map((m) => m.href)).toContain('/gallery');
		for (const role of ['learner', 'school_admin'] as const) expect(menuFor([role]).map((m) => m.href)).not.toContain('/gallery');
	});
});
