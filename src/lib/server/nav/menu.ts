import type { Role } from '../auth/roles';

export type MenuItem = { href: string; label: string };

type Entry = MenuItem & { roles: Role[] | 'signed-in' };

// The pages a person sees in the navigation; each page's own guard enforces the same roles.
const ENTRIES: Entry[] = [
	{ href: '/home', label: 'Home', roles: 'signed-in' },
	{ href: '/learn', label: 'Practice', roles: ['learner'] },
	{ href: '/progress', label: 'Progress', roles: ['learner'] },
	{ href: '/exam', label: 'Mock exam', roles: ['learner'] },
	{ href: '/bench', label: 'Bench', roles: ['learner', 'instructor', 'author'] },
	{ href: '/profile', label: 'Profile', roles: 'signed-in' },
	{ href: '/author', label: 'Write items', roles: ['author'] },
	{ href: '/review', label: 'Review', roles: ['reviewer'] },
	{ href: '/gallery', label: 'Circuits', roles: ['author', 'reviewer', 'instructor', 'site_admin'] },
	{ href: '/admin/users', label: 'People and roles', roles: ['site_admin'] }
];

export function menuFor(roles: Role[] | null): MenuItem[] {
	if (!roles) return [];
	return ENTRIES.filter((e) => e.roles === 'signed-in' || e.roles.some((r) => roles.includes(r))).map(
		({ href, label }) => ({ href, label })
	);
}
