// For db tests: a unique e-mail per call, so test files never trip over each other's rows.
import { randomBytes } from 'node:crypto';

export function uniqueEmail(label: string): string {
	return `${label}-${randomBytes(4).toString('hex')}@harrowcreek.example`;
}
