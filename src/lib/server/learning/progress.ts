/** The progress page's data: ability over time, reviews due, accuracy and minutes per day, streak, weakest skills. */
import { and, eq, gte } from 'drizzle-orm';
import { AREAS, findSkill } from '$lib/items/blueprint';
import { daysBetween, learningDay, learningStreak, reviewsDueByDay, weakestSkills, addDays } from '$lib/learning';
import type { Db } from '../db/client';
import { abilitySnapshot, response } from '../db/schema';
import { skillPrior } from './catalog';
import { abilitiesOf, cardsOf, ensureProfile, skillDifficulties } from './profile';
import { readinessOf } from './exam';

export type ProgressData = {
	today: string;
	examDate: string | null;
	daysToExam: number | null;
	streak: number;
	abilitySeries: { area: string; title: string; points: { day: string; theta: number }[] }[];
	reviewsDue: { day: string; count: number }[];
	perDay: { day: string; answers: number; right: number; accuracy: number; minutes: number }[];
	weakest: { skillId: string; title: string; area: string; predictedSuccess: number; retention: number | null }[];
	readiness: { probability: number; cutScore: number } | null;
	answers: number;
};

export async function progressOf(db: Db, learner: { id: string; timeZone: string }, now = new Date(), days = 30): Promise<ProgressData> {
	const profile = await ensureProfile(db, learner.id);
	const today = learningDay(now, learner.timeZone);
	const snaps = await db.select().from(abilitySnapshot).where(eq(abilitySnapshot.userId, learner.id)).orderBy(abilitySnapshot.day);
	const abilitySeries = AREAS.map((a) => ({ area: a.id, title: a.title, points: snaps.filter((s) => s.area === a.id).map((s) => ({ day: s.day, theta: s.theta })) })).filter((s) => s.points.length > 0);
	const { cards } = await cardsOf(db, learner.id);
	const since = new Date(now.getTime() - (days + 1) * 86_400_000);
	const rows = await db
		.select({ at: response.createdAt, correct: response.correct, ms: response.ms })
		.from(response)
		.where(and(eq(response.userId, learner.id), gte(response.createdAt, since)));
	const perDayMap = new Map<string, { answers: number; right: number; ms: number }>();
	for (const r of rows) {
		const d = learningDay(r.at, learner.timeZone);
		const e = perDayMap.get(d) ?? { answers: 0, right: 0, ms: 0 };
		e.answers++;
		if (r.correct) e.right++;
		e.ms += r.ms;
		perDayMap.set(d, e);
	}
	const perDay = Array.from({ length: 14 }, (_, i) => addDays(today, i - 13)).map((day) => {
		const e = perDayMap.get(day) ?? { answers: 0, right: 0, ms: 0 };
		return { day, answers: e.answers, right: e.right, accuracy: e.answers ? e.right / e.answers : 0, minutes: Math.round(e.ms / 6000) / 10 };
	});
	const difficulty = await skillDifficulties(db);
	const abilities = await abilitiesOf(db, learner.id);
	const skills = Object.keys(cards).map((id) => ({ id, area: findSkill(id)?.area ?? '', difficulty: difficulty[id] ?? skillPrior(id) }));
	const weakest = weakestSkills({ skills, cards, abilities, now, limit: 5 }).map((w) => ({
		skillId: w.skillId,
		title: findSkill(w.skillId)?.title ?? w.skillId,
		area: w.area,
		predictedSuccess: w.predictedSuccess,
		retention: w.retention
	}));
	const answers = rows.length;
	const r = Object.keys(abilities).length > 0 ? await readinessOf(db, learner.id) : null;
	return {
		today,
		examDate: profile.examDate,
		daysToExam: profile.examDate ? daysBetween(today, profile.examDate) : null,
		streak: learningStreak([...perDayMap.keys()], now, learner.timeZone),
		abilitySeries,
		reviewsDue: reviewsDueByDay(Object.values(cards), now, learner.timeZone, 14),
		perDay,
		weakest,
		readiness: r ? { probability: r.probability, cutScore: r.cutScore } : null,
		answers
	};
}
