/** An expected problem with a learner's request: a code for clients, a message a person can act on, an HTTP status. */
export class LearnError extends Error {
	constructor(
		readonly code: string,
		message: string,
		readonly status = 400,
		readonly fields: Record<string, string> = {}
	) {
		super(message);
		this.name = 'LearnError';
	}
}
