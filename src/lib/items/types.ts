/**
 * Types of the item bank: what an author or a generator writes (`ItemSource`), what the build makes
 * of it (`BuiltItem`), and what a learner sends back (`Response`).
 */
import type { Reads, WhatIf } from '../circuit';

/** The seven item kinds. */
export const KINDS = ['numeric', 'choose-one', 'choose-all', 'select-diagram', 'predict-works', 'claim-check', 'next-test'] as const;
export type Kind = (typeof KINDS)[number];

/** Where an ask is evaluated: a state of the circuit (null = defaults) and an optional fault (`open:W3`). */
export type Where = { state: string | null; fault: string | null };

/** A question that has one value for an answer (a number or a word), expressed against the engine. */
export type ScalarAsk =
	| ({ type: 'volts'; point: string } & Where)
	| ({ type: 'reads'; point: string } & Where)
	| ({ type: 'status'; part: string } & Where)
	| ({ type: 'amps'; part: string } & Where)
	| ({ type: 'watts'; part: string } & Where)
	| ({ type: 'drop'; from: string; to: string } & Where);

/** Every ask. A complaint is observations as the engine reads them: `STATE: PART=STATUS, POINT=READS; ...`. */
export type Ask =
	| ScalarAsk
	| ({ type: 'path'; through: string } & Where)
	| ({ type: 'shared'; through: [string, string] } & Where)
	| ({ type: 'works'; loads: string[] } & Where)
	| { type: 'opens'; complaint: string }
	| { type: 'candidates'; complaint: string; among: string[] | null }
	| { type: 'next-test'; complaint: string }
	| { type: 'claims'; claims: Claim[] };

/** One statement of a claim-check item: the engine judges whether `ask` has the value `is`. */
export type Claim = { text: string; ask: ScalarAsk; is: string | number };

/** A scalar answer: a number in the ask's unit, or a word (a status or a reading class). */
export type Value = number | string;

/** What an author or a generator writes. `line` maps a front-matter key to its line, for errors. */
export type ItemSource = {
	id: string;
	area: string;
	skill: string;
	kind: Kind;
	family: string | null;
	/** The file the item came from (`content/items/x.md`) or `family:ID`. */
	origin: string;
	circuitText: string;
	/** Where the circuit came from: `content/circuits/NAME.yaml`, `inline`, or `family:ID`. */
	circuitRef: string;
	ask: Ask;
	/** Numeric tolerance in the ask's unit; null for the default. */
	tolerance: number | null;
	tags: string[];
	stem: string;
	explanation: string;
	/** A key stated by hand, in the form of the kind's key (see docs/item-format.md); undefined when none. */
	statedKey?: unknown;
	lines?: Record<string, number>;
};

/** A wrong answer and the mistake it models; `via` is the engine solve it came from (absent for set-based ones). */
export type Distractor = { tag: string; value: unknown; label: string; via?: { state: string | null; fault: string | null; whatIf?: WhatIf } };

/** One option of a choose-one or choose-all item. */
export type Option = { id: string; label: string };

/** What the learner sees of the question (never the key). */
export type QuestionPayload =
	| { kind: 'numeric'; quantity: 'volts' | 'amps' | 'watts' | 'drop'; unit: 'V' | 'A' | 'W'; tolerance: number; state: string | null }
	| { kind: 'choose-one'; options: Option[]; state: string | null }
	| { kind: 'choose-all'; options: Option[] }
	| { kind: 'select-diagram'; selectable: string[]; state: string | null }
	| { kind: 'predict-works'; loads: string[]; statuses: ['on', 'weak', 'off']; state: string | null }
	| { kind: 'claim-check'; statements: string[] }
	| { kind: 'next-test'; states: string[]; points: string[] };

/** The key, by kind. */
export type Key =
	| {
			kind: 'numeric';
			value: number;
			unit: 'V' | 'A' | 'W';
			tolerance: number;
			/** For point volts: the point's reading class, and the battery EMF in force it is judged against. */
			reads: Reads | null;
			emf: number | null;
	  }
	| { kind: 'choose-one'; choice: string; value: Value }
	| { kind: 'choose-all'; choices: string[] }
	| { kind: 'select-diagram'; elements: string[] }
	| { kind: 'predict-works'; loads: Record<string, string> }
	| { kind: 'claim-check'; verdicts: boolean[]; values: Value[] }
	| {
			kind: 'next-test';
			state: string;
			point: string;
			candidates: string[];
			/** Expected candidates left after each test, by `STATE/POINT`. */
			expectedLeft: Record<string, number>;
	  };

/** What the feedback screen needs: the path or fault to highlight and the readings that matter. */
export type FeedbackData = {
	state: string | null;
	fault: string | null;
	/** Elements to highlight (a current path, or the elements of the key). */
	highlight: string[];
	/** Point readings in the ask's state (and fault), by label. */
	readings: Record<string, { volts: number; reads: Reads }>;
	/** Short engine sentences on why (relays, fuses, points). */
	notes: string[];
};

/** One built item, ready for the database and the learner. */
export type BuiltItem = {
	id: string;
	/** Hash of the content hash and the key hash: a changed item or a changed key gets a new version. */
	version: string;
	contentHash: string;
	keyHash: string;
	area: string;
	skill: string;
	difficulty: number;
	kind: Kind;
	family: string | null;
	origin: string;
	circuitText: string;
	circuitRef: string;
	stemHtml: string;
	explanationHtml: string;
	/** What was asked of the engine (server side only, like the key). */
	ask: Ask;
	question: QuestionPayload;
	key: Key;
	distractors: Distractor[];
	cautions: { id: string; text: string }[];
	feedback: FeedbackData;
	tags: string[];
};

/** A learner's response, by kind. */
export type Response =
	| { value: number }
	| { choice: string }
	| { choices: string[] }
	| { elements: string[] }
	| { loads: Record<string, string> }
	| { verdicts: boolean[] }
	| { state: string; point: string };

/** One build error: where, what is wrong, and what to do. */
export type BuildError = { file: string; line: number; message: string; fix: string };
