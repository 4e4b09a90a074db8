// What the author routes share: turning authoring refusals into form failures a person can act on.
import { error, fail } from '@sveltejs/kit';
import { AuthoringError } from '$lib/server/content/authoring';

export const NEW_ITEM_TEMPLATE = `---
id: my-new-item
area: diagrams-paths
skill: point-readings
kind: numeric
circuit: content/circuits/cooling-fan-relay.yaml
ask: { volts: C, state: hot }
---
With the engine hot, what does a meter read from point C to ground?

## Explanation

Say why, in a sentence or two.
`;

/** A form failure for an authoring refusal; anything else is rethrown (and logged by handleError). */
export function authoringFailure(e: unknown, source: string) {
	if (!(e instanceof AuthoringError)) throw e;
	if (e.code === 'not_found') error(404, 'There is no such item of yours. Go back to your items.');
	if (e.code === 'forbidden') error(403, e.message);
	return fail(400, { message: e.message, fields: { source }, errors: e.errors.map((x) => ({ line: x.line, message: x.message, fix: x.fix })) });
}
