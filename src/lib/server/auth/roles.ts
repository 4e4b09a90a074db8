// The roles a person can hold; one person may hold several (user_role join table).
export const ROLES = ['learner', 'instructor', 'author', 'reviewer', 'school_admin', 'site_admin'] as const;

export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
	learner: 'Learner',
	instructor: 'Instructor',
	author: 'Author',
	reviewer: 'Reviewer',
	school_admin: 'School admin',
	site_admin: 'Site admin'
};

export function isRole(value: unknown): value is Role {
	return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}
