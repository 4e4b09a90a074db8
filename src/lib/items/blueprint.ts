/**
 * The blueprint of the item bank: our content areas with their weights, the skills (each in one
 * area, with a prior difficulty), and the safety cautions an item shows.
 */

/** A content area: `weight` is its share of a full practice test, in percent (the weights sum to 100). */
export type Area = { id: string; title: string; weight: number };

export const AREAS = [
	{ id: 'meters-basics', title: 'Meters and circuit basics', weight: 12 },
	{ id: 'diagrams-paths', title: 'Reading diagrams and current paths', weight: 14 },
	{ id: 'power-distribution', title: 'Power distribution and protection', weight: 14 },
	{ id: 'battery-starting', title: 'Battery and starting', weight: 10 },
	{ id: 'charging', title: 'Charging', weight: 8 },
	{ id: 'lighting-signalling', title: 'Lighting and signalling', weight: 10 },
	{ id: 'motors-body', title: 'Motors, heaters and body circuits', weight: 10 },
	{ id: 'sensors-inputs', title: 'Sensors and module inputs', weight: 10 },
	{ id: 'diagnostic-strategy', title: 'Diagnostic strategy', weight: 12 }
] as const satisfies readonly Area[];

export type AreaId = (typeof AREAS)[number]['id'];

/**
 * A skill: `difficulty` is the prior on a logit scale (−2 easy … +2 hard); every variant of a skill
 * starts from it until answers say otherwise.
 */
export type Skill = { id: string; area: AreaId; title: string; difficulty: number };

export const SKILLS: readonly Skill[] = [
	{ id: 'ohms-law', area: 'meters-basics', title: "Ohm's law and power in a load", difficulty: -1 },
	{ id: 'series-parallel', area: 'meters-basics', title: 'Series and parallel loads', difficulty: 0 },
	{ id: 'reading-classes', area: 'meters-basics', title: 'What a meter shows: supply, ground, partial, floating', difficulty: -0.5 },
	{ id: 'meter-vs-lamp', area: 'meters-basics', title: 'Meter readings against test-lamp readings', difficulty: 0.8 },
	{ id: 'point-readings', area: 'diagrams-paths', title: 'Predicting a point’s reading from the diagram', difficulty: 0 },
	{ id: 'current-paths', area: 'diagrams-paths', title: 'Tracing a current path', difficulty: 0.3 },
	{ id: 'shared-paths', area: 'diagrams-paths', title: 'What two current paths share', difficulty: 0.6 },
	{ id: 'relay-operation', area: 'power-distribution', title: 'Relay coil and contact operation', difficulty: 0.2 },
	{ id: 'shared-protection', area: 'power-distribution', title: 'Loads sharing a fuse or a ground', difficulty: 0.5 },
	{ id: 'fuse-faults', area: 'power-distribution', title: 'Fuses, shorts and what they take out', difficulty: 0.4 },
	{ id: 'voltage-drop', area: 'power-distribution', title: 'Voltage drop on feed and ground sides', difficulty: 0.6 },
	{ id: 'battery-voltage', area: 'battery-starting', title: 'Battery voltage at rest and under load', difficulty: -0.5 },
	{ id: 'cranking-circuit', area: 'battery-starting', title: 'Starter control and cranking circuits', difficulty: 0.5 },
	{ id: 'cranking-drop', area: 'battery-starting', title: 'Cranking voltage drop in cables and terminals', difficulty: 0.9 },
	{ id: 'charging-voltage', area: 'charging', title: 'Charging system voltage and current', difficulty: 0 },
	{ id: 'charging-faults', area: 'charging', title: 'Charging circuit faults', difficulty: 0.7 },
	{ id: 'lamp-circuits', area: 'lighting-signalling', title: 'Lamp circuits and switches', difficulty: -0.3 },
	{ id: 'indicator-lamps', area: 'lighting-signalling', title: 'Indicator lamps beside coils and loads', difficulty: 0.3 },
	{ id: 'high-resistance-feeds', area: 'lighting-signalling', title: 'Lamps fed through high resistance', difficulty: 0.9 },
	{ id: 'motor-speeds', area: 'motors-body', title: 'Motor speeds and dropping resistors', difficulty: 0.2 },
	{ id: 'relay-loads', area: 'motors-body', title: 'Relay-switched motors and heaters', difficulty: 0.3 },
	{ id: 'body-switches', area: 'motors-body', title: 'Multi-position body switches', difficulty: 0.1 },
	{ id: 'sensor-reference', area: 'sensors-inputs', title: 'Sensor circuits on a 5 V reference', difficulty: 0.6 },
	{ id: 'sensor-signal-faults', area: 'sensors-inputs', title: 'Sensor signal and ground faults', difficulty: 1 },
	{ id: 'fault-candidates', area: 'diagnostic-strategy', title: 'Which faults explain a complaint', difficulty: 0.8 },
	{ id: 'open-location', area: 'diagnostic-strategy', title: 'Where an open explains a complaint', difficulty: 0.9 },
	{ id: 'next-test', area: 'diagnostic-strategy', title: 'Choosing the next test', difficulty: 1.2 },
	{ id: 'complaint-prediction', area: 'diagnostic-strategy', title: 'Predicting what a fault does', difficulty: 0.5 }
];

const SKILL_BY_ID = new Map(SKILLS.map((s) => [s.id, s]));
const AREA_IDS = new Set<string>(AREAS.map((a) => a.id));

/** The skill with this id, or undefined. */
export function findSkill(id: string): Skill | undefined {
	return SKILL_BY_ID.get(id);
}

/** True for a known area id. */
/** An area's title for people ("Reading diagrams and current paths"); the id itself when it is unknown. */
export function areaTitle(id: string): string {
	return AREAS.find((a) => a.id === id)?.title ?? id;
}

export function isArea(id: string): id is AreaId {
	return AREA_IDS.has(id);
}

/** One safety caution, with the source it comes from. */
export type Caution = { id: string; text: string; source: string };

export const CAUTIONS = {
	hydrogen: {
		id: 'hydrogen',
		text: 'Charging batteries give off hydrogen, which is explosive in air: ventilate, and keep sparks and flames away.',
		source: 'CCOHS, OSH Answers, "Battery charging"'
	},
	jewellery: { id: 'jewellery', text: 'Remove rings and watches: short-circuit current can weld metal and burn.', source: 'common practice' },
	groundFirst: { id: 'ground-first', text: 'Disconnect the ground cable first and reconnect it last.', source: 'common practice' },
	airbag: {
		id: 'airbag',
		text: 'Never probe airbag (supplemental restraint) circuits with a test lamp or an ordinary meter; after disconnecting the battery, wait the time the vehicle’s service information states.',
		source: 'common practice'
	},
	highVoltage: {
		id: 'high-voltage',
		text: 'High-voltage hybrid and electric systems (orange cables) are for trained, qualified people only, with rated gloves and meters, after the maker’s disabling procedure.',
		source: 'common practice'
	},
	noPiercing: { id: 'no-piercing', text: 'Do not pierce wire insulation to probe; a pierced wire corrodes and opens later.', source: 'common practice' },
	serviceInfo: {
		id: 'service-info',
		text: 'Always defer to the vehicle maker’s service information and to local codes and licensed practice.',
		source: 'common practice'
	}
} as const satisfies Record<string, Caution>;

/**
 * The cautions an item shows, from its area, skill and tags: battery work (the battery and charging
 * areas, or the tag `battery`), airbag circuits (tag `airbag`), high voltage (tag `high-voltage`);
 * items that send the learner to probe a circuit add the insulation caution. Empty for other items.
 */
export function cautionsFor(area: string, skill: string, tags: readonly string[]): Caution[] {
	const out: Caution[] = [];
	const battery = area === 'battery-starting' || area === 'charging' || tags.includes('battery');
	if (battery) out.push(CAUTIONS.hydrogen, CAUTIONS.jewellery, CAUTIONS.groundFirst);
	if (tags.includes('airbag')) out.push(CAUTIONS.airbag);
	if (tags.includes('high-voltage')) out.push(CAUTIONS.highVoltage);
	if (out.length === 0) return out;
	if (skill === 'next-test' || skill === 'open-location') out.push(CAUTIONS.noPiercing);
	out.push(CAUTIONS.serviceInfo);
	return out;
}
