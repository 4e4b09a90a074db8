/** The learner home's summary of today: where the set stands, reviews due, days to the exam. */
import { and, eq, lte, sql } from 'drizzle-orm';
import { daysBetween, learningDay } from '$lib/learning';
import type { Db } from '../db/client';
import { practiceSet, skillCard } from '../db/schema';
import { ensureProfile } from './profile';
import type { SetEntry } from './sets';

export type TodaySummary = {
	phase: 'placement' | 'daily';
	started: boolean;
	itemsLeft: number | null;
	total: number | null;
	reviewsDue: number;
	examDate: string | null;
	daysToExam: number | null;
};

export async function todayOf(db: Db, learner: { id: string; timeZone: string }, now = new Date()): Promise<TodaySummary> {
	const profile = await ensureProfile(db, learner.id);
	const day = learningDay(now, learner.timeZone);
	const [{ n }] = await db
		.select({ n: sql<number>`count(*)` })
		.from(skillCard)
		.where(and(eq(skillCard.userId, learner.id), lte(skillCard.due, now)));
	const base = { reviewsDue: Number(n), examDate: profile.examDate, daysToExam: profile.examDate ? daysBetween(day, profile.examDate) : null };
	if (!profile.placementDoneAt) {
		const [p] = await db.select().from(practiceSet).where(and(eq(practiceSet.userId, learner.id), eq(practiceSet.kind, 'placement')));
		return { ...base, phase: 'placement', started: !!p && p.position > 0, itemsLeft: 12 - (p?.position ?? 0), total: 12 };
	}
	const [s] = await db.select().from(practiceSet).where(and(eq(practiceSet.userId, learner.id), eq(practiceSet.kind, 'daily'), eq(practiceSet.day, day)));
	if (!s) return { ...base, phase: 'daily', started: false, itemsLeft: null, total: null };
	const entries = s.entries as SetEntry[];
	return { ...base, phase: 'daily', started: s.position > 0, itemsLeft: Math.max(0, entries.length - s.position), total: entries.length };
}
