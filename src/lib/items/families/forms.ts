/**
 * Question forms: from one family variant, the candidate items of each form. A form lists its
 * candidates in order of preference; the build keeps the first one the engine can key (a choose-one
 * needs a distractor, a next test needs two candidates left, ...). Choices are seeded, so the same
 * seed gives the same items.
 */
import type { AreaId } from '../blueprint';
import { evalScalar, type CircuitCtx } from '../engine';
import { formatValue } from '../compile';
import { faultWords } from '../words';
import { shortHash } from '../hash';
import type { Rng } from '../rng';
import type { Ask, Claim, ItemSource, Kind, ScalarAsk, Where } from '../types';
import type { Family, FamilyVariant } from './family';

/** The question forms, with the kind each makes and how many items each variant gives (the first that key). */
export const FORMS = [
	{ id: 'point-volts', kind: 'numeric', take: 2 },
	{ id: 'point-reads', kind: 'choose-one', take: 2 },
	{ id: 'part-status', kind: 'choose-one', take: 2 },
	{ id: 'load-current', kind: 'numeric', take: 1 },
	{ id: 'voltage-drop', kind: 'numeric', take: 1 },
	{ id: 'load-power', kind: 'numeric', take: 1 },
	{ id: 'load-path', kind: 'select-diagram', take: 2 },
	{ id: 'shared-path', kind: 'select-diagram', take: 1 },
	{ id: 'open-wires', kind: 'select-diagram', take: 1 },
	{ id: 'predict-loads', kind: 'predict-works', take: 2 },
	{ id: 'judge-claims', kind: 'claim-check', take: 1 },
	{ id: 'fault-candidates', kind: 'choose-all', take: 1 },
	{ id: 'next-test', kind: 'next-test', take: 1 }
] as const satisfies readonly { id: string; kind: Kind; take: number }[];

export type FormId = (typeof FORMS)[number]['id'];

function whereWords(ctx: CircuitCtx, v: FamilyVariant, w: Where): string {
	const st = w.state ? (v.states[w.state] ?? `state ${w.state}`) : 'the switches at rest';
	return w.fault ? `With ${st} and ${faultWords(ctx, w.fault)}` : `With ${st}`;
}

function valueWords(ask: ScalarAsk, value: string | number): string {
	if (ask.type === 'reads') return value === 'supply' ? 'battery voltage' : value === 'ground' ? 'about 0 V (ground)' : value === 'partial' ? 'a voltage between 0 V and the battery’s' : 'about 0 V with no path to anything (floating)';
	if (typeof value === 'number') return formatValue(ask.type, value);
	return value;
}

function subjectWords(ask: ScalarAsk): string {
	switch (ask.type) {
		case 'volts':
		case 'reads':
			return `point ${ask.point}`;
		case 'status':
			return ask.part;
		case 'amps':
			return `the current through ${ask.part}`;
		case 'watts':
			return `the power in ${ask.part}`;
		case 'drop':
			return `the drop from ${ask.from} to ${ask.to}`;
	}
}

type Ctx = { family: Family; variant: FamilyVariant; ctx: CircuitCtx; rng: Rng; variantRng: Rng };
type Draft = { ask: Ask; stem: string; explanation: string; area?: AreaId; skill?: string; tolerance?: number };

const SPREAD = (rng: Rng, v: FamilyVariant): Where[] => {
	const states = [v.work, ...(v.rest ? [v.rest] : [])];
	const out: Where[] = [];
	for (const f of rng.shuffle(v.faults)) out.push({ state: rng.pick(states), fault: f });
	out.push({ state: v.work, fault: null });
	return out;
};

function labelled(ctx: CircuitCtx): string[] {
	return ctx.circuit.points.map((p) => p.label);
}

function partsOfType(ctx: CircuitCtx, types: string[]): string[] {
	return ctx.circuit.parts.filter((p) => types.includes(p.type)).map((p) => p.id);
}

/** The complaint a fault produces: the loads' statuses (and any relay's) in each working state, read from the engine. */
export function complaintOf(x: Ctx, fault: string, withPoint: string | null): string | null {
	const c = observe(x, fault, withPoint);
	return c && c !== observe(x, null, withPoint) ? c : null;
}

function observe(x: Ctx, fault: string | null, withPoint: string | null): string | null {
	const { variant: v, ctx } = x;
	const states = [v.work, ...(v.rest ? [v.rest] : [])];
	const watch = v.watch ?? [...v.loads.slice(0, 1), ...partsOfType(ctx, ['relay'])];
	const points = labelled(ctx);
	const chunks: string[] = [];
	for (const s of states) {
		const obs: string[] = [];
		for (const l of watch) {
			try {
				const ask: ScalarAsk = points.includes(l) ? { type: 'reads', point: l, state: s, fault } : { type: 'status', part: l, state: s, fault };
				obs.push(`${l}=${evalScalar(ctx, ask).value}`);
			} catch {
				return null;
			}
		}
		if (withPoint && s === v.work) {
			try {
				obs.push(`${withPoint}=${evalScalar(ctx, { type: 'reads', point: withPoint, state: s, fault }).value}`);
			} catch {
				return null;
			}
		}
		chunks.push(`${s}: ${obs.join(', ')}`);
	}
	return chunks.join('; ');
}

function complaintWords(x: Ctx, complaint: string): string {
	return complaint
		.split(';')
		.map((chunk) => {
			const [s, body] = chunk.split(':').map((t) => t.trim());
			return `with ${x.variant.states[s] ?? s}: ${body.replace(/=/g, ' ').replace(/, /g, ', ')}`;
		})
		.join('; ');
}

/** Drafts from the complaints of the faults in order, computed only as far as the build reads. */
function* lazyComplaints(x: Ctx, faults: string[], make: (complaint: string) => Draft): Generator<Draft> {
	for (const f of faults) {
		const c = complaintOf(x, f, null);
		if (c) yield make(c);
	}
}

const DRAFTS: Record<FormId, (x: Ctx) => Iterable<Draft>> = {
	'point-volts': (x) =>
		SPREAD(x.rng, x.variant).flatMap((w) =>
			x.rng.shuffle(labelled(x.ctx)).slice(0, 2).map((p) => ({
				ask: { type: 'volts', point: p, ...w } as Ask,
				stem: `${x.variant.title} ${whereWords(x.ctx, x.variant, w)}, what does a digital meter read from point **${p}** to ground? Answer in volts.`,
				explanation: `The meter reads {{key}}. {{why}}.`
			}))
		),
	'point-reads': (x) =>
		SPREAD(x.rng, x.variant).flatMap((w) =>
			x.rng.shuffle(labelled(x.ctx)).slice(0, 2).map((p) => ({
				ask: { type: 'volts', point: p, ...w } as Ask,
				stem: `${x.variant.title} ${whereWords(x.ctx, x.variant, w)}, which reading does a digital meter show from point **${p}** to ground?`,
				explanation: `Point ${p} reads {{key}}. {{why}}.`,
				area: 'meters-basics',
				skill: 'reading-classes'
			}))
		),
	'part-status': (x) =>
		SPREAD(x.rng, x.variant).flatMap((w) =>
			x.rng.shuffle(partsOfType(x.ctx, ['relay', 'fuse', 'fusible-link', 'breaker', 'lamp', 'motor', 'horn', 'heater', 'solenoid'])).slice(0, 2).map((p) => ({
				ask: { type: 'status', part: p, ...w } as Ask,
				stem: `${x.variant.title} ${whereWords(x.ctx, x.variant, w)}, what is the state of **${p}**?`,
				explanation: `${p} is {{key}}. {{why}}.`
			}))
		),
	'load-current': (x) => {
		const part = x.variant.currentPart ?? x.variant.loads[0];
		if (!part) return [];
		return [{ state: x.variant.work, fault: null }, ...x.variant.faults.filter((f) => f.startsWith('high-resistance')).map((f) => ({ state: x.variant.work, fault: f }))].map((w) => ({
			ask: { type: 'amps', part, ...w } as Ask,
			stem: `${x.variant.title} ${whereWords(x.ctx, x.variant, w)}, how much current flows through **${part}**? Answer in amps.`,
			explanation: `{{key}} flows through ${part}. {{why}}.`
		}));
	},
	'voltage-drop': (x) =>
		x.variant.drop
			? [
					{
						ask: { type: 'drop', from: x.variant.drop.from, to: x.variant.drop.to, state: x.variant.drop.state, fault: x.variant.drop.fault } as Ask,
						stem: `${x.variant.title} ${whereWords(x.ctx, x.variant, x.variant.drop)}, a meter's red lead is on **${x.variant.drop.from}** and its black lead on **${x.variant.drop.to}** (${x.variant.drop.words}). What does it read? Answer in volts.`,
						explanation: `The meter reads the difference of the two points' volts: {{key}}. {{why}}.`
					}
				]
			: [],
	'load-power': (x) =>
		x.variant.loads.slice(0, 2).map((l) => ({
			ask: { type: 'watts', part: l, state: x.variant.work, fault: null } as Ask,
			stem: `${x.variant.title} ${whereWords(x.ctx, x.variant, { state: x.variant.work, fault: null })}, how much power does **${l}** take? Answer in watts.`,
			explanation: `Power is the volts across the load times its current: {{key}}. {{why}}.`,
			area: 'meters-basics',
			skill: 'ohms-law'
		})),
	'load-path': (x) => {
		const relays = partsOfType(x.ctx, ['relay']);
		const targets = x.rng.shuffle([...x.variant.loads, ...relays.map((r) => `${r}.coil`)]);
		const wheres: Where[] = [{ state: x.variant.work, fault: null }, ...x.variant.faults.filter((f) => f.startsWith('short-to-ground') || f.startsWith('high')).map((f) => ({ state: x.variant.work, fault: f }))];
		return targets.flatMap((t) =>
			wheres.map((w) => ({
				ask: { type: 'path', through: t, ...w } as Ask,
				stem: `${x.variant.title} ${whereWords(x.ctx, x.variant, w)}, select every part and wire that carries the current through **${t}**.`,
				explanation: `The current through ${t} flows through {{key}}. {{why}}.`,
				area: 'diagrams-paths',
				skill: 'current-paths'
			}))
		);
	},
	'shared-path': (x) =>
		x.variant.shared
			? [
					{
						ask: { type: 'shared', through: x.variant.shared, state: x.variant.work, fault: null } as Ask,
						stem: `${x.variant.title} ${whereWords(x.ctx, x.variant, { state: x.variant.work, fault: null })}, select every part and wire that carries both the current through **${x.variant.shared[0]}** and the current through **${x.variant.shared[1]}**.`,
						explanation: `The two paths share {{key}}.`,
						area: 'diagrams-paths',
						skill: 'shared-paths'
					}
				]
			: [],
	'open-wires': (x) =>
		lazyComplaints(x, x.rng.shuffle(x.variant.faults.filter((f) => f.startsWith('open:') && x.ctx.circuit.wires.some((w) => `open:${w.id}` === f))), (complaint) => ({
			ask: { type: 'opens', complaint } as Ask,
			stem: `${x.variant.title} The complaint, ${complaintWords(x, complaint)}. Select every wire where an open would explain it.`,
			explanation: `An open in {{key}} explains the complaint. {{why}}.`,
			area: 'diagnostic-strategy',
			skill: 'open-location'
		})),
	'predict-loads': (x) =>
		x.variant.loads.length === 0
			? []
			: x.rng.shuffle(x.variant.faults).map((f) => {
			const w = { state: x.variant.work, fault: f };
			return {
				ask: { type: 'works', loads: x.variant.loads, ...w } as Ask,
				stem: `${x.variant.title} ${whereWords(x.ctx, x.variant, w)}, predict each load: on, weak or off.`,
				explanation: `{{key}}. {{why}}.`
			};
		}),
	'judge-claims': function* (x) {
		// lazy: each candidate solves its claims, and the build stops at the first it can key
		const pts = labelled(x.ctx);
		for (const w of SPREAD(x.rng, x.variant).filter((q) => q.fault)) {
			const picks = x.rng.shuffle(pts).slice(0, 2);
			const claims: Claim[] = [];
			for (let i = 0; i < picks.length; i++) {
				const p = picks[i];
				const ask: ScalarAsk = i === 0 ? { type: 'reads', point: p, ...w } : { type: 'volts', point: p, ...w };
				// claim the value the point would have without the fault, or with it: the engine decides which is true
				const alt: ScalarAsk = x.rng.next() < 0.5 ? ask : { ...ask, fault: null };
				let is: string | number;
				try {
					is = evalScalar(x.ctx, alt).value;
				} catch {
					break;
				}
				claims.push({ text: `${whereWords(x.ctx, x.variant, w)}, ${subjectWords(ask)} reads ${valueWords(ask, is)}.`, ask, is });
			}
			if (claims.length !== picks.length) continue;
			yield {
				ask: { type: 'claims', claims },
				stem: `${x.variant.title} Judge each statement true or false.`,
				explanation: `{{key}}. {{why}}.`
			};
		}
	},
	'fault-candidates': (x) =>
		lazyComplaints(x, x.variantRng.shuffle(x.variant.faults), (complaint) => ({
			ask: { type: 'candidates', complaint, among: null } as Ask,
			stem: `${x.variant.title} The complaint, ${complaintWords(x, complaint)}. Which of these faults would explain it? Choose every one that does.`,
			explanation: `{{key}} explain the complaint; the others would also change something that was observed as normal.`,
			area: 'diagnostic-strategy',
			skill: 'fault-candidates'
		})),
	'next-test': (x) =>
		lazyComplaints(x, x.variantRng.shuffle(x.variant.faults), (complaint) => ({
			ask: { type: 'next-test', complaint } as Ask,
			stem: `${x.variant.title} The complaint, ${complaintWords(x, complaint)}. Which labelled point, in which switch position, do you measure next to narrow the faults down fastest?`,
			explanation: `Measure {{key}}: it splits the possible faults best. {{why}}.`,
			area: 'diagnostic-strategy',
			skill: 'next-test'
		}))
};

/** Skill of a form in the family's own area. */
function familySkill(f: Family, form: FormId): string {
	switch (form) {
		case 'point-volts':
			return f.skills.reading;
		case 'part-status':
			return f.skills.status;
		case 'load-current':
			return f.skills.current;
		case 'voltage-drop':
			return f.skills.drop;
		case 'predict-loads':
			return f.skills.works;
		default:
			return f.skills.claims;
	}
}

/**
 * The candidate item sources of one form for one variant, in order of preference. `rng` is the
 * form's own; `variantRng` is made afresh for each form from the variant's seed, so forms that draw
 * from it (the complaint forms) pick the same complaint and share its diagnosis. Ids are the
 * family, the form and a hash of the circuit and the ask, so the same variant gives the same ids.
 */
export function* draftItems(family: Family, variant: FamilyVariant, ctx: CircuitCtx, form: FormId, rng: Rng, variantRng: Rng): Generator<ItemSource> {
	const kind = FORMS.find((f) => f.id === form)!.kind;
	for (const d of DRAFTS[form]({ family, variant, ctx, rng, variantRng }))
		yield {
			id: `${family.id}-${form}-${shortHash(ctx.hash + JSON.stringify(d.ask))}`,
			area: d.area ?? family.area,
			skill: d.skill ?? familySkill(family, form),
			kind,
			family: family.id,
			origin: `family:${family.id}`,
			circuitText: variant.circuit,
			circuitRef: `family:${family.id}`,
			ask: d.ask,
			tolerance: d.tolerance ?? null,
			tags: variant.tags ?? [],
			stem: d.stem,
			explanation: d.explanation
		};
}
