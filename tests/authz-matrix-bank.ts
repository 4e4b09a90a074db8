// Authorization matrix entries for the item bank: authoring, review, previews. Part of tests/authz-matrix.ts; same rules.
// The entries run in this order on the app tests' database, which `npm start` seeded with the demo bank:
// the author creates "matrix-draft", saves and submits it, and a reviewer approves it.
import type { MatrixEntry } from './authz-matrix';

const draft = (id: string, stem: string) => `---
id: ${id}
area: diagrams-paths
skill: point-readings
kind: numeric
circuit: content/circuits/cooling-fan-relay.yaml
ask: { volts: D, state: hot }
---
${stem}
`;

const MATRIX_DRAFT = 'matrix-draft';

export const BANK_ROUTES: MatrixEntry[] = [
	{ kind: 'page', route: '/author', allow: ['author'] },
	{ kind: 'page', route: '/author/items/new', allow: ['author'] },
	{
		kind: 'action',
		route: '/author/items/new',
		action: 'save',
		allow: ['author'],
		form: () => ({ source: draft(MATRIX_DRAFT, 'With the engine hot, what does a meter read from point D to ground?') }),
		outcome: { redirect: `/author/items/${MATRIX_DRAFT}` }
	},
	{
		kind: 'action',
		route: '/author/items/new',
		action: 'upload',
		allow: ['author'],
		form: () => ({ file: draft('matrix-upload', 'Uploaded: with the engine hot, what does point D read?') }),
		outcome: { redirect: '/author/items/matrix-upload' }
	},
	{ kind: 'page', route: '/author/items/[id]', path: `/author/items/${MATRIX_DRAFT}`, allow: ['author'] },
	{
		kind: 'action',
		route: '/author/items/[id]',
		action: 'save',
		path: `/author/items/${MATRIX_DRAFT}`,
		allow: ['author'],
		form: () => ({ source: draft(MATRIX_DRAFT, 'With the engine hot and the fan running, what does a meter read from point D to ground?') }),
		outcome: { redirect: `/author/items/${MATRIX_DRAFT}` }
	},
	{
		kind: 'action',
		route: '/author/items/[id]',
		action: 'submit',
		path: `/author/items/${MATRIX_DRAFT}`,
		allow: ['author'],
		form: () => ({}),
		outcome: { redirect: `/author/items/${MATRIX_DRAFT}` }
	},
	// An empty body previews empty markdown: a 200 whose errors say the front matter is missing.
	{ kind: 'endpoint', route: '/api/author/preview', method: 'POST', allow: ['author'] },
	{ kind: 'page', route: '/review', allow: ['reviewer'] },
	{ kind: 'page', route: '/review/items/[id]', path: `/review/items/${MATRIX_DRAFT}`, allow: ['reviewer'] },
	{
		kind: 'action',
		route: '/review/items/[id]',
		action: 'approve',
		path: `/review/items/${MATRIX_DRAFT}`,
		allow: ['reviewer'],
		form: () => ({}),
		outcome: { redirect: '/review' }
	},
	{
		kind: 'action',
		route: '/review/items/[id]',
		action: 'requestChanges',
		path: '/review/items/demo-fan-relay-switched-side',
		allow: ['reviewer'],
		form: () => ({ comment: 'Name the meter leads: red on B, black on ground.' }),
		outcome: { redirect: '/review' }
	},
	{
		kind: 'action',
		route: '/review/items/[id]',
		action: 'retire',
		path: '/review/items/matrix-upload',
		allow: ['reviewer'],
		form: () => ({ comment: 'Duplicate of matrix-draft.' }),
		outcome: { redirect: '/review' }
	},
	{ kind: 'page', route: '/review/families/[id]', path: '/review/families/feed-side-relay', allow: ['reviewer'] },
	{
		kind: 'action',
		route: '/review/families/[id]',
		action: 'approve',
		path: '/review/families/feed-side-relay',
		allow: ['reviewer'],
		form: () => ({}),
		outcome: { redirect: '/review' }
	}
];
