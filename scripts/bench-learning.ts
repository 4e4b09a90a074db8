/**
 * Benchmark of the learning logic (src/lib/learning) on simulated learners over 60 days, with the exam on
 * day 60. The simulated memory is NOT FSRS: a power-law forgetting curve with a per-learner decay,
 * interference between skills of one area and a guessing floor on choice items (docs/learning.md,
 * "The benchmark's learner"). Its constants (MODEL) were fixed before any of our parameters were tuned.
 *
 * Arms, on the same seeded random numbers:
 *   ours   placement, then daily sets from composeDailySet, reviews scheduled by scheduleReview;
 *   fixed  the same skills introduced on the same days as in "ours", each reviewed every 3 days;
 *   random placement by uniformly random items (placement comparison only).
 * Ends with one JSON line:
 *   {"retention_ours", "retention_fixed", "reviews_ours", "reviews_fixed", "placement_items_ours",
 *    "placement_items_random", "practice_accuracy", "readiness_brier"}
 * Goals: retention_ours ≥ retention_fixed − 0.01 with reviews_ours ≤ 0.75 · reviews_fixed;
 * placement_items_ours ≤ 0.7 · placement_items_random (= 20); practice accuracy in [0.80, 0.90];
 * readiness Brier ≤ 0.20. Exits 1 when a goal is missed.
 * Tuning knobs: BENCH_LEARNERS, BENCH_SEED, BENCH_OURS and BENCH_RETENTION (JSON), BENCH_CALIBRATE=1 or fit,
 * BENCH_OFFSET=population|learner|off (the new-skill success offset, docs/learning.md).
 * BENCH_ORACLE=1 adds the frontier check (docs/learning.md, "Why accuracy and review count conflict"): an
 * oracle arm that knows each simulated learner's true recall reviews the same skills, introduced on the same
 * days, whenever the recall at the session would be below a threshold r (and once more before the exam when
 * the exam-day recall would be below 0.9), for several r; it prints accuracy and reviews against fixed
 * intervals for each r. It changes nothing in the JSON line.
 */
import {
	addDays,
	assembleMockExam,
	calibrateMemoryFactor,
	calibrateSuccessOffset,
	composeDailySet,
	learningDayStart,
	makeRng,
	nextPlacementItem,
	placementAbilities,
	priorDifficulty,
	rateAnswer,
	readiness,
	scheduleReview,
	updateAbility,
	updateDifficulty,
	type Estimate,
	type FirstAnswer,
	type PlacementCandidate,
	type PlacementResponse,
	type ReviewRecord,
	type Rng,
	type SkillInfo,
	type StoredCard
} from '../src/lib/learning/index';

/** The simulated learner's memory model; fixed, not tuned to the scheduler (docs/learning.md). */
const MODEL = {
	/** Overall ability ~ N(0, ABILITY_SD²); each area deviates by N(0, AREA_SD²). */
	ABILITY_SD: 1,
	AREA_SD: 0.5,
	/** Power-law forgetting R(t) = (1 + t / s)^(−c), with c per learner, uniform in [DECAY_MIN, DECAY_MAX]. */
	DECAY_MIN: 0.5,
	DECAY_MAX: 0.9,
	/** Memory strength s (days) after the first study. */
	FIRST_STRENGTH: 2,
	/** After a right answer at recall R: s ← s + GAIN · (s + 1) · (1 − R) (spacing: more gain when more was forgotten). */
	GAIN: 3,
	/** After a wrong answer (with the feedback shown): s ← LAPSE_KEEP · s + LAPSE_ADD. */
	LAPSE_KEEP: 0.5,
	LAPSE_ADD: 0.5,
	/** Interference: each study of another skill of the same area adds this many days to a skill's age. */
	INTERFERENCE_DAYS: 0.1,
	/** A skill never studied is solved at the Rasch chance; once studied, at recall × Rasch chance + LEARNING_GAIN logits. */
	LEARNING_GAIN: 1,
	/** Choice items: a guessing floor of 1 in 4; share of skills whose items are choice items. */
	GUESS: 0.25,
	CHOICE_SHARE: 0.6,
	/** Answer time: median × exp(N(0, TIME_SD²)) × (1 + SLOW_WHEN_FORGOTTEN · (1 − R)). */
	TIME_SD: 0.35,
	SLOW_WHEN_FORGOTTEN: 0.6
};

/** Our parameters for the run (the only ones tuned). */
const OURS = { maxItems: 40, maxMinutes: 30, maxNew: 4, ...JSON.parse(process.env.BENCH_OURS ?? '{}') };
/** Overrides of the scheduler's retention settings for tuning runs (defaults: those of schedule.ts). */
const RETENTION = { ...JSON.parse(process.env.BENCH_RETENTION ?? '{}') };

/**
 * BENCH_CALIBRATE=1 turns on the per-learner memory factor (off: it did not help on this model, docs/learning.md);
 * BENCH_CALIBRATE=fit fits it with a free ceiling k (calibrateMemoryFactor's fitCeiling).
 */
const CALIBRATE = process.env.BENCH_CALIBRATE === '1' || process.env.BENCH_CALIBRATE === 'fit';
const FIT_CEILING = process.env.BENCH_CALIBRATE === 'fit';
/**
 * New-skill success offset (calibrateSuccessOffset) from first answers: 'population' (all learners' first
 * answers so far, as the server can read them from its response history), 'learner' (this learner's own) or 'off'.
 */
const OFFSET = (process.env.BENCH_OFFSET ?? 'population') as 'population' | 'learner' | 'off';
const LEARNERS = Number(process.env.BENCH_LEARNERS ?? 300);
const DAYS = 60;
const AREAS = ['meters', 'diagrams', 'distribution', 'starting', 'charging', 'lighting', 'body', 'sensors', 'strategy'];
const WEIGHTS: Record<string, number> = { meters: 12, diagrams: 14, distribution: 14, starting: 10, charging: 8, lighting: 10, body: 10, sensors: 10, strategy: 12 };
const SKILLS_PER_AREA = 8;
const VARIANTS_PER_SKILL = 8;
const MEDIAN_SECONDS = 40;
const ZONES = ['America/Denver', 'Europe/Berlin', 'Asia/Tokyo', 'America/New_York', 'Australia/Sydney'];
const START_DAY = '2026-09-14';

function normal(rng: Rng): number {
	const u = Math.max(1e-12, rng.next());
	return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rng.next());
}
const sigma = (x: number) => 1 / (1 + Math.exp(-x));

type PoolSkill = { id: string; area: string; trueDifficulty: number; prior: number; choice: boolean; variants: { id: string; trueDifficulty: number }[] };

function buildPool(rng: Rng): PoolSkill[] {
	const out: PoolSkill[] = [];
	for (const area of AREAS)
		for (let k = 0; k < SKILLS_PER_AREA; k++) {
			const b = 1.5 * normal(rng);
			const id = `${area}-${k}`;
			out.push({
				id,
				area,
				trueDifficulty: b,
				prior: b + 0.5 * normal(rng),
				choice: rng.next() < MODEL.CHOICE_SHARE,
				variants: Array.from({ length: VARIANTS_PER_SKILL }, (_, v) => ({ id: `${id}-v${v}`, trueDifficulty: b + 0.15 * normal(rng) }))
			});
		}
	return out;
}

/** One simulated learner's true state. */
class Learner {
	ability: Record<string, number> = {};
	decay: number;
	strength = new Map<string, number>();
	lastStudy = new Map<string, number>();
	interference = new Map<string, number>();
	constructor(
		rng: Rng,
		public overall: number
	) {
		for (const a of AREAS) this.ability[a] = overall + MODEL.AREA_SD * normal(rng);
		this.decay = MODEL.DECAY_MIN + (MODEL.DECAY_MAX - MODEL.DECAY_MIN) * rng.next();
	}
	/** Memory recall of a skill at time `day` (fractional days); null when never studied. */
	recall(skill: PoolSkill, day: number): number | null {
		const s = this.strength.get(skill.id);
		if (s == null) return null;
		const age = day - this.lastStudy.get(skill.id)! + MODEL.INTERFERENCE_DAYS * (this.interference.get(skill.id) ?? 0);
		return Math.pow(1 + Math.max(0, age) / s, -this.decay);
	}
	pCorrect(skill: PoolSkill, variantDifficulty: number, day: number): { p: number; recall: number } {
		const r = this.recall(skill, day);
		const know = r == null ? sigma(this.ability[skill.area] - variantDifficulty) : r * sigma(this.ability[skill.area] - variantDifficulty + MODEL.LEARNING_GAIN);
		const g = skill.choice ? MODEL.GUESS : 0;
		return { p: g + (1 - g) * know, recall: r ?? 1 };
	}
	/** An answer with feedback is a study event. */
	study(skill: PoolSkill, day: number, correct: boolean, pool: PoolSkill[]) {
		const r = this.recall(skill, day);
		const s = this.strength.get(skill.id);
		let next: number;
		if (s == null || r == null) next = MODEL.FIRST_STRENGTH;
		else if (correct) next = s + MODEL.GAIN * (s + 1) * (1 - r);
		else next = MODEL.LAPSE_KEEP * s + MODEL.LAPSE_ADD;
		this.strength.set(skill.id, next);
		this.lastStudy.set(skill.id, day);
		this.interference.set(skill.id, 0);
		for (const other of pool) if (other.area === skill.area && other.id !== skill.id && this.strength.has(other.id)) this.interference.set(other.id, (this.interference.get(other.id) ?? 0) + 1);
	}
}

/** Local session time: 19:00 on learning day `d`, as fractional days since START_DAY (04:00 + 15 h). */
const SESSION_OFFSET = 15 / 24;
const EXAM_OFFSET = 5 / 24; // 09:00 on the exam day

function sessionInstant(day: number, zone: string): number {
	return learningDayStart(addDays(START_DAY, day), zone).getTime() + SESSION_OFFSET * 86_400_000;
}

type Outcome = { correct: boolean; seconds: number };
function answer(rng: Rng, learner: Learner, skill: PoolSkill, variantId: string, day: number): Outcome {
	const v = skill.variants.find((x) => x.id === variantId)!;
	const { p, recall } = learner.pCorrect(skill, v.trueDifficulty, day);
	const correct = rng.next() < p;
	const seconds = MEDIAN_SECONDS * Math.exp(MODEL.TIME_SD * normal(rng)) * (1 + MODEL.SLOW_WHEN_FORGOTTEN * (1 - recall));
	return { correct, seconds };
}

function placementCandidates(pool: PoolSkill[], difficulty: Map<string, Estimate>): PlacementCandidate[] {
	return pool.map((s) => ({ id: s.variants[0].id, skillId: s.id, area: s.area, difficulty: difficulty.get(s.id)!.value, guess: s.choice ? MODEL.GUESS : 0 }));
}

// ---------------------------------------------------------------- placement comparison
function placementComparison(pool: PoolSkill[], seed: number): { ours: number; random: number; rmseOurs: number[]; rmseRandom: number[] } {
	const N = 30;
	const people = 400;
	const priors = new Map(pool.map((s) => [s.id, priorDifficulty(s.prior)]));
	const cands = placementCandidates(pool, priors);
	const sq = { ours: new Array(N + 1).fill(0), random: new Array(N + 1).fill(0) };
	for (let i = 0; i < people; i++) {
		const base = makeRng(seed * 7919 + i);
		const learner = new Learner(base, MODEL.ABILITY_SD * normal(base));
		for (const arm of ['ours', 'random'] as const) {
			const rng = makeRng(`${seed}:${i}:answers`); // the same answer draws for both arms
			const pick = makeRng(`${seed}:${i}:pick`);
			const responses: PlacementResponse[] = [];
			for (let n = 1; n <= N; n++) {
				let item: PlacementCandidate;
				if (arm === 'ours') item = nextPlacementItem({ candidates: cands, responses, length: N, seed: `${seed}:${i}` })!.item;
				else {
					const used = new Set(responses.map((r) => r.skillId));
					const open = cands.filter((c) => !used.has(c.skillId));
					item = open[pick.int(open.length)];
				}
				const skill = pool.find((s) => s.id === item.skillId)!;
				responses.push({ ...item, correct: answer(rng, learner, skill, item.id, 0).correct });
				const est = placementAbilities(responses, AREAS).overall;
				sq[arm][n] += (est - learner.overall) ** 2;
			}
		}
	}
	const rmseOurs = sq.ours.map((x) => Math.sqrt(x / people));
	const rmseRandom = sq.random.map((x) => Math.sqrt(x / people));
	const target = rmseRandom[20];
	let ours = N;
	for (let n = 1; n <= N; n++)
		if (rmseOurs[n] <= target) {
			ours = n;
			break;
		}
	return { ours, random: 20, rmseOurs, rmseRandom };
}

// ---------------------------------------------------------------- 60 days
type Tally = { right: number; answers: number; byKind: Record<'review' | 'new', { n: number; right: number; predicted: number; recall: number; ceiling: number }> };
type ArmResult = { retention: number; reviews: number; introduced: Map<string, number> };

function runOurs(pool: PoolSkill[], learner: Learner, zone: string, seed: string, difficulty: Map<string, Estimate>, tally: Tally, population: FirstAnswer[]) {
	const rng = makeRng(`${seed}:answers`);
	const examDate = addDays(START_DAY, DAYS);
	const cards: Record<string, StoredCard> = {};
	const lastVariant: Record<string, string> = {};
	const lastSeen: Record<string, number> = {};
	const introduced = new Map<string, number>();
	let reviews = 0;
	const history: ReviewRecord[] = [];
	let memoryFactor = 1;
	const mineFirst: FirstAnswer[] = [];

	// Day 0: placement (no feedback, so no study), then abilities per area.
	const responses: PlacementResponse[] = [];
	const cands = placementCandidates(pool, difficulty);
	for (;;) {
		const next = nextPlacementItem({ candidates: cands, responses, seed });
		if (!next) break;
		const skill = pool.find((s) => s.id === next.item.skillId)!;
		const v = skill.variants[rng.int(skill.variants.length)];
		responses.push({ ...next.item, id: v.id, correct: answer(rng, learner, skill, v.id, SESSION_OFFSET).correct });
	}
	const abilities: Record<string, Estimate> = placementAbilities(responses, AREAS).areas;

	for (let day = 1; day < DAYS; day++) {
		const now = sessionInstant(day, zone);
		if (CALIBRATE && day % 7 === 0) memoryFactor = calibrateMemoryFactor(history, { fitCeiling: FIT_CEILING });
		const skills: SkillInfo[] = pool.map((s) => ({ id: s.id, area: s.area, difficulty: difficulty.get(s.id)!.value, guess: s.choice ? MODEL.GUESS : 0, variants: s.variants.map((v) => ({ id: v.id, medianSeconds: MEDIAN_SECONDS })) }));
		const successOffset = OFFSET === 'off' ? 0 : calibrateSuccessOffset(OFFSET === 'learner' ? mineFirst : population);
		const set = composeDailySet({ now, timeZone: zone, skills, cards, lastVariant, abilities, examDate, settings: OURS, seed: `${seed}:${day}`, successOffset });
		for (const item of set.items) {
			const skill = pool.find((s) => s.id === item.skillId)!;
			const t = day + SESSION_OFFSET;
			const trueRecall = learner.recall(skill, t);
			const v = skill.variants.find((x) => x.id === item.itemId)!;
			tally.byKind[item.kind].recall += trueRecall ?? 1;
			tally.byKind[item.kind].ceiling += sigma(learner.ability[skill.area] - v.trueDifficulty + (trueRecall == null ? 0 : MODEL.LEARNING_GAIN));
			const out = answer(rng, learner, skill, item.itemId, t);
			tally.answers++;
			if (out.correct) tally.right++;
			const k = tally.byKind[item.kind];
			k.n++;
			k.right += out.correct ? 1 : 0;
			k.predicted += item.predictedSuccess;
			if (item.kind === 'review') reviews++;
			else introduced.set(skill.id, day);
			learner.study(skill, t, out.correct, pool);
			const rating = rateAnswer({ correct: out.correct, seconds: out.seconds, medianSeconds: MEDIAN_SECONDS });
			const before = cards[skill.id];
			if (before?.last_review) history.push({ elapsedDays: (now - Date.parse(before.last_review)) / 86_400_000, stability: before.stability, correct: out.correct, guess: skill.choice ? MODEL.GUESS : 0 });
			cards[skill.id] = scheduleReview(before ?? null, rating, now, { timeZone: zone, examDate, memoryFactor, ...RETENTION }).card;
			lastVariant[skill.id] = item.itemId;
			lastSeen[item.itemId] = now;
			const a = abilities[skill.area];
			const d = difficulty.get(skill.id)!;
			const g = skill.choice ? MODEL.GUESS : 0;
			if (item.kind === 'new') for (const list of [mineFirst, population]) list.push({ ability: a.value, difficulty: d.value, guess: g, correct: out.correct });
			abilities[skill.area] = updateAbility(a, d.value, out.correct, g);
			difficulty.set(skill.id, updateDifficulty(d, a.value, out.correct, g));
		}
	}
	const examT = DAYS + EXAM_OFFSET;
	const retention = mean([...introduced.keys()].map((id) => learner.recall(pool.find((s) => s.id === id)!, examT)!));
	if (process.env.BENCH_DEBUG) console.log('ours', [...introduced.keys()].map((id) => `${(examT - learner.lastStudy.get(id)!).toFixed(1)}/${learner.strength.get(id)!.toFixed(1)}`).join(' '), 'm', memoryFactor.toFixed(2));
	return { retention, reviews, introduced, abilities, lastSeen };
}

function runFixed(pool: PoolSkill[], learner: Learner, seed: string, introduced: Map<string, number>): ArmResult {
	const rng = makeRng(`${seed}:answers`);
	let reviews = 0;
	for (let day = 1; day < DAYS; day++) {
		const t = day + SESSION_OFFSET;
		for (const [id, first] of introduced) {
			if (day < first || (day - first) % 3 !== 0) continue;
			const skill = pool.find((s) => s.id === id)!;
			const v = skill.variants[rng.int(skill.variants.length)];
			const out = answer(rng, learner, skill, v.id, t);
			if (day > first) reviews++;
			learner.study(skill, t, out.correct, pool);
		}
	}
	const examT = DAYS + EXAM_OFFSET;
	if (process.env.BENCH_DEBUG) console.log('fixed', [...introduced.keys()].map((id) => `${(examT - learner.lastStudy.get(id)!).toFixed(1)}/${learner.strength.get(id)!.toFixed(1)}`).join(' '));
	return { retention: mean([...introduced.keys()].map((id) => learner.recall(pool.find((s) => s.id === id)!, examT)!)), reviews, introduced };
}

/** Thresholds of the oracle arm (BENCH_ORACLE=1). */
const ORACLE_THRESHOLDS = [0.75, 0.8, 0.85, 0.88, 0.9, 0.92, 0.95];
const ORACLE = process.env.BENCH_ORACLE === '1';
type OracleTally = { reviews: number; right: number; answers: number; retention: number[] };

/**
 * The oracle arm: the same skills, introduced on the same days as in "ours" (their first answer counts
 * toward accuracy as in ours), reviewed on a session day when the simulated learner's TRUE recall then is
 * below r, and on the last day before the exam when the true exam-day recall would be below 0.9.
 * No scheduler can do better at keeping recall at review near r, so its accuracy and review count for each r
 * trace the best trade-off this learner model allows for these skills.
 */
function runOracle(pool: PoolSkill[], learner: Learner, seed: string, introduced: Map<string, number>, r: number, into: OracleTally) {
	const rng = makeRng(`${seed}:answers`);
	const examT = DAYS + EXAM_OFFSET;
	const skills = [...introduced].map(([id, first]) => ({ skill: pool.find((s) => s.id === id)!, first }));
	for (let day = 1; day < DAYS; day++) {
		const t = day + SESSION_OFFSET;
		for (const { skill, first } of skills) {
			if (day < first) continue;
			let isNew = day === first;
			if (!isNew) {
				const now = learner.recall(skill, t)!;
				const last = day === DAYS - 1 && learner.recall(skill, examT)! < 0.9;
				if (now >= r && !last) continue;
			}
			const v = skill.variants[rng.int(skill.variants.length)];
			const out = answer(rng, learner, skill, v.id, t);
			into.answers++;
			if (out.correct) into.right++;
			if (!isNew) into.reviews++;
			learner.study(skill, t, out.correct, pool);
			isNew = false;
		}
	}
	into.retention.push(mean(skills.map(({ skill }) => learner.recall(skill, examT)!)));
}

function mean(xs: number[]): number {
	return xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : 0;
}

function main() {
	const seed = Number(process.env.BENCH_SEED ?? 20260601);
	const pool = buildPool(makeRng(`pool:${seed}`));
	const started = performance.now();

	const placement = placementComparison(pool, seed);
	console.log(`placement RMSE of the overall ability by items (ours / random):`);
	for (const n of [4, 8, 12, 14, 16, 20, 24]) console.log(`  ${String(n).padStart(2)} items: ${placement.rmseOurs[n].toFixed(3)} / ${placement.rmseRandom[n].toFixed(3)}`);

	// Difficulties shared by all learners, calibrated from the generator's prior as learners answer.
	const difficulty = new Map(pool.map((s) => [s.id, priorDifficulty(s.prior)]));
	const tally: Tally = { right: 0, answers: 0, byKind: { review: { n: 0, right: 0, predicted: 0, recall: 0, ceiling: 0 }, new: { n: 0, right: 0, predicted: 0, recall: 0, ceiling: 0 } } };
	const ret = { ours: [] as number[], fixed: [] as number[] };
	const population: FirstAnswer[] = [];
	let reviewsOurs = 0;
	let reviewsFixed = 0;
	let brier = 0;
	let passes = 0;
	const oracle = ORACLE_THRESHOLDS.map((r) => ({ r, tally: { reviews: 0, right: 0, answers: 0, retention: [] } as OracleTally }));
	for (let i = 0; i < LEARNERS; i++) {
		const zone = ZONES[i % ZONES.length];
		const make = () => {
			const r = makeRng(`learner:${seed}:${i}`);
			return new Learner(r, MODEL.ABILITY_SD * normal(r));
		};
		const mine = make();
		const o = runOurs(pool, mine, zone, `${seed}:${i}`, difficulty, tally, population);
		const f = runFixed(pool, make(), `${seed}:${i}`, o.introduced);
		if (ORACLE) for (const arm of oracle) runOracle(pool, make(), `${seed}:${i}`, o.introduced, arm.r, arm.tally);
		ret.ours.push(o.retention);
		ret.fixed.push(f.retention);
		reviewsOurs += o.reviews;
		reviewsFixed += f.reviews;

		// Exam day: a mock exam of items unseen for 30 days, our readiness for it, then the simulated result.
		const examNow = learningDayStart(addDays(START_DAY, DAYS), zone).getTime() + EXAM_OFFSET * 86_400_000;
		const exam = assembleMockExam({
			candidates: pool.flatMap((s) => s.variants.map((v) => ({ id: v.id, skillId: s.id, area: s.area }))),
			weights: WEIGHTS,
			lastSeen: o.lastSeen,
			now: examNow,
			seed: `${seed}:${i}:exam`
		});
		const forecast = readiness({ abilities: o.abilities, items: exam.items.map((it) => ({ area: it.area, difficulty: difficulty.get(it.skillId)!.value, guess: pool.find((s) => s.id === it.skillId)!.choice ? MODEL.GUESS : 0 })) });
		const rng = makeRng(`${seed}:${i}:exam-answers`);
		let right = 0;
		for (const it of exam.items) if (answer(rng, mine, pool.find((s) => s.id === it.skillId)!, it.id, DAYS + EXAM_OFFSET).correct) right++;
		const passed = right >= forecast.passMark ? 1 : 0;
		passes += passed;
		brier += (forecast.probability - passed) ** 2;
	}
	const result = {
		retention_ours: round(mean(ret.ours)),
		retention_fixed: round(mean(ret.fixed)),
		reviews_ours: reviewsOurs,
		reviews_fixed: reviewsFixed,
		placement_items_ours: placement.ours,
		placement_items_random: placement.random,
		practice_accuracy: round(tally.right / tally.answers),
		readiness_brier: round(brier / LEARNERS)
	};
	console.log(`${LEARNERS} learners × ${DAYS} days, ${pool.length} skills × ${VARIANTS_PER_SKILL} variants, ${tally.answers} practice answers, pass rate ${(passes / LEARNERS).toFixed(2)}, ${((performance.now() - started) / 1000).toFixed(1)} s`);
	for (const kind of ['new', 'review'] as const) {
		const k = tally.byKind[kind];
		console.log(`  ${kind}: ${k.n} answers, ${(k.right / k.n).toFixed(3)} right, ${(k.predicted / k.n).toFixed(3)} predicted (Rasch); simulated: recall ${(k.recall / k.n).toFixed(3)}, Rasch chance ${(k.ceiling / k.n).toFixed(3)}`);
	}
	if (ORACLE) {
		console.log('oracle arm (true recall known; same skills and days as ours): threshold r, practice accuracy, reviews / fixed, exam-day retention − fixed');
		for (const { r, tally: t } of oracle)
			console.log(`  r = ${r.toFixed(2)}: accuracy ${(t.right / t.answers).toFixed(4)}, reviews ${t.reviews} = ${(t.reviews / reviewsFixed).toFixed(3)} × fixed, retention ${(mean(t.retention) - mean(ret.fixed)).toFixed(4)}`);
	}
	const goals = [
		['retention within 0.01 of fixed or better', result.retention_ours >= result.retention_fixed - 0.01],
		['at least 25 % fewer reviews', result.reviews_ours <= 0.75 * result.reviews_fixed],
		['placement needs at least 30 % fewer items', result.placement_items_ours <= 0.7 * result.placement_items_random],
		['practice accuracy in [0.80, 0.90]', result.practice_accuracy >= 0.8 && result.practice_accuracy <= 0.9],
		['readiness Brier at most 0.20', result.readiness_brier <= 0.2]
	] as const;
	for (const [name, ok] of goals) console.log(`  ${ok ? 'met ' : 'MISS'} ${name}`);
	console.log(JSON.stringify(result));
	if (goals.some(([, ok]) => !ok)) process.exitCode = 1;
}

function round(x: number): number {
	return Math.round(x * 10000) / 10000;
}

main();
