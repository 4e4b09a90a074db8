import { describe, expect, it } from 'vitest';
import { menuFor } from './menu';

// Each person sees only what their roles allow (the route guards enforce the same; see tests/authz-matrix.ts).
describe('menuFor', () => {
	it('shows nothing to an anonymous visitor', () => expect(menuFor(null)).toEqual([]));

	it('shows a learner their own pages only', () => {
		expect(menuFor(['learner']).map((m) => m.href)).toEqual(['/home', '/learn', '/progress', '/exam', '/bench', '/profile']);
	});

	it('adds people and roles for a site admin', () => {
		expect(menuFor(['learner', 'site_admin']).map((m) => m.href)).toEqual(['/home', '/learn', '/progress', '/exam', '/bench', '/profile', '/admin/users']);
	});
});
