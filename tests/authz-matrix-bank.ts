// Authorization matrix entries for the item bank: authoring, review, previews. Part of tests/authz-matrix.ts; same rules.
import type { MatrixEntry } from './authz-matrix';

export const BANK_ROUTES: MatrixEntry[] = [];
