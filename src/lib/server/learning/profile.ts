/** The learner's settings (exam date, daily size) and stored estimates, read for scheduling. */
import { eq } from 'drizzle-orm';
import type { Estimate, StoredCard } from '$lib/learning';
import type { Db } from '../db/client';
import { areaAbility, learnerProfile, skillCard, skillDifficulty } from '../db/schema';
import type { Q } from './record';

export type LearnerProfile = typeof learnerProfile.$inferSelect;

/** The learner's profile row, created with the defaults on first use. */
export async function ensureProfile(q: Q, userId: string): Promise<LearnerProfile> {
	const [found] = await q.select().from(learnerProfile).where(eq(learnerProfile.userId, userId));
	if (found) return found;
	await q.insert(learnerProfile).ignore().values({ userId });
	const [made] = await q.select().from(learnerProfile).where(eq(learnerProfile.userId, userId));
	return made!;
}

export async function saveSettings(db: Db, userId: string, s: { examDate: string | null; dailyItems: number; dailyMinutes: number }): Promise<void> {
	await ensureProfile(db, userId);
	await db.update(learnerProfile).set({ ...s, updatedAt: new Date() }).where(eq(learnerProfile.userId, userId));
}

export async function abilitiesOf(q: Q, userId: string): Promise<Record<string, Estimate>> {
	const rows = await q.select().from(areaAbility).where(eq(areaAbility.userId, userId));
	return Object.fromEntries(rows.map((r) => [r.area, { value: r.theta, count: r.n }]));
}

export async function cardsOf(q: Q, userId: string): Promise<{ cards: Record<string, StoredCard>; lastVariant: Record<string, string> }> {
	const rows = await q.select().from(skillCard).where(eq(skillCard.userId, userId));
	const cards: Record<string, StoredCard> = {};
	const lastVariant: Record<string, string> = {};
	for (const r of rows) {
		cards[r.skill] = r.card as StoredCard;
		if (r.lastItemId) lastVariant[r.skill] = r.lastItemId;
	}
	return { cards, lastVariant };
}

/** Calibrated skill difficulties (logits) by skill id; skills without answers are absent. */
export async function skillDifficulties(q: Q): Promise<Record<string, number>> {
	const rows = await q.select().from(skillDifficulty);
	return Object.fromEntries(rows.map((r) => [r.skill, r.beta]));
}
