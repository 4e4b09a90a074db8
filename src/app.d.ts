import type { Role } from '$lib/server/auth/roles';

declare global {
	namespace App {
		interface Error {
			message: string;
			/** Quoted by the person when they report the problem; the server log holds the details under it. */
			id?: string;
		}
		interface Locals {
			user: {
				id: string;
				email: string;
				name: string;
				timeZone: string;
				schoolId: number | null;
				emailVerifiedAt: Date | null;
				roles: Role[];
			} | null;
			sessionId: string | null;
		}
	}
}

export {};
