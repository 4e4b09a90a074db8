// Authorization matrix entries for circuit diagrams: the gallery. Part of tests/authz-matrix.ts; same rules.
import type { MatrixEntry } from './authz-matrix';

export const DIAGRAM_ROUTES: MatrixEntry[] = [
	{ kind: 'page', route: '/gallery', allow: ['author', 'reviewer', 'instructor', 'site_admin'] }
];
