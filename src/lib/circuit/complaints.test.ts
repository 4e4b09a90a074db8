/**
 * Customer complaints, diagnosed by hand. Each complaint is turned into observations, and the expected
 * candidate set (standard-list order, spec "Diagnosis") and next best test (least Σ nᵢ² / N; ties by
 * state order, then point order) are worked out below in comments, fault by fault, from the circuit
 * alone — no engine output was used. The working uses the spec's model: ideal battery, 1 mohm fuses,
 * 0.01 ohm shorts at a wire's midpoint, 1 ohm high-resistance faults, loads on >= 80 % and weak >= 25 %
 * of EMF / R, reads within 0.2 V of the EMF or of 0 V, floating when no conducting path reaches B+ or GND.
 */
import { describe, expect, it } from 'vitest';
import { diagnose, parseCircuit, parseObservations, standardFaults, formatFault } from './index';

/**
 * Circuit H (6 parts): cab heater and pilot lamp on one switch.
 * Standard list (27): W1..W6 x (open, short-to-ground, high-resistance); open:F1; open:S1,
 * stuck-closed:S1; open:L1, shorted:L1; open:H1, shorted:H1; open:G1; open:G2.
 * Sound, switch on: L1 = 144/5 = 28.8 ohm draws 0.4164 A (on), H1 2 ohm draws 5.997 A (on), F1 6.4 A.
 * Facts used below (state on):
 *  - short-to-ground on W2, W3, W4 (after the fuse): 12 / 0.011 = 1090 A > 15 A, F1 blows, all off.
 *    On W1 (before the fuse) the ideal battery holds B+; nothing changes. On W5, W6 (ground side)
 *    the short sits beside an ideal ground: nothing changes.
 *  - high-resistance 1 ohm on W1 or W2: 2 || 28.8 = 1.870 ohm, I = 12 / 2.871 = 4.180 A, A = 7.816 V:
 *    H1 3.908 A (65 %, weak), L1 0.2714 A (65 %, weak). On W4 or W6: H1 12 / 3 = 4.0 A (67 %, weak),
 *    L1 on. On W3 or W5: L1 12 / 29.8 = 0.403 A (97 %, on), H1 on.
 *  - shorted L1 or H1 (0.01 ohm): 1090 A, F1 blows, all off. open:F1 reads blown.
 */
const HEATER = `
id: complaint-cab-heater
title: Cab heater with a pilot lamp on one switch
supply: 12.0
parts:
  F1: { type: fuse, amps: 15 }
  S1: { type: switch }
  L1: { type: lamp, watts: 5 }
  H1: { type: heater, ohms: 2 }
  G1: { type: ground }
  G2: { type: ground }
wires:
  - B+ F1.1        # W1
  - F1.2 S1.1      # W2
  - S1.2 L1.1      # W3
  - S1.2 H1.1      # W4
  - L1.2 G1        # W5
  - H1.2 G2        # W6
points:
  A: S1.2
  B: H1.1
  C: H1.2
  D: S1.1
states:
  off: { S1: open }
  on: { S1: closed }
`;

/**
 * Circuit F (7 parts): radiator fan relay, coil switched on its ground side (as golden/fan-relay.yaml).
 * Standard list (37): W1..W6, FEED, W8 x (open, short-to-ground, high-resistance); open:F1; open:F2;
 * open:K1.coil, open:K1.87, open:K1.87a, shorted:K1.coil, stuck-closed:K1; open:S1, stuck-closed:S1;
 * open:M1, shorted:M1; open:G1; open:G2.
 * Sound, on: coil 12.6 / 80 = 0.1575 A (energized); M1 1.05 ohm, loop 1.0776 ohm, 11.69 A (97 %, on);
 * K1.87 = 12.588 V (supply), M1.1 = 12.277 V (partial).
 * Facts used below:
 *  - coil side W1..W4: short-to-ground on W2 blows F1 (in every state: it is before S1); on W1 it is
 *    before F1 (nothing); on W3 it grounds K1.85 (coil energized even with S1 open, 12.598 V); on W4
 *    it sits beside S1's ground (nothing). High-resistance 1 ohm on the coil side: 12.6 * 80 / 81 =
 *    12.44 V, still energized.
 *  - load side: short-to-ground on W6 or FEED (after F2) blows F2 (W6 in every state; FEED only when
 *    energized); on W5 (before F2) nothing; on W8 (ground side) nothing. High-resistance 1 ohm on W5,
 *    W6, FEED or W8: 12.6 / 2.0776 = 6.065 A, 50.5 % of 12 A: weak.
 *  - shorted:K1.coil: 12.6 / 0.011 = 1145 A through F1 when S1 closes: F1 blows, released.
 *    shorted:M1 blows F2 when energized.
 */
const FAN = `
id: complaint-fan-relay
title: Radiator fan relay, coil switched to ground
supply: 12.6
parts:
  F1: { type: fuse, amps: 10 }
  F2: { type: fuse, amps: 30 }
  K1: { type: relay }
  S1: { type: switch }
  M1: { type: motor, amps: 12 }
  G1: { type: ground }
  G2: { type: ground }
wires:
  - B+ F1.1                  # W1
  - F1.2 K1.86               # W2
  - K1.85 S1.1               # W3
  - S1.2 G1                  # W4
  - B+ F2.1                  # W5
  - F2.2 K1.30               # W6
  - { from: K1.87, to: M1.1, id: FEED, gauge_mm2: 1.5, length_m: 2 }
  - M1.2 G2                  # W8
points:
  A: K1.85
  B: K1.87
  C: M1.1
  D: M1.2
states:
  off: { S1: open }
  on: { S1: closed }
`;

type Complaint = {
	says: string;
	circuit: string;
	observe: string;
	candidates: string[];
	next_test: { state: string; point: string; expected_left: number; outcomes: Record<string, string[]> } | null;
};

const COMPLAINTS: Complaint[] = [
	{
		// Reproduce "on: L1=on, H1=off": only an open in the heater's own branch. open:W4, open:W6,
		// open:H1, open:G2 do; high-resistance on W4/W6 leaves H1 weak, not off; every short after the
		// fuse blows F1 (L1 off); opens elsewhere darken L1.
		// Reads of the 4 candidates (W4o, W6o, H1o, G2o):
		//   off: A, B, C ground for all (through the cold loads), D supply for all -> 16/4 = 4 each.
		//   on:  A supply x4 -> 4. B (H1.1): W4o ground (cut from the feed, H1 to G2), others supply
		//        -> (1 + 9)/4 = 2.5. C (H1.2): W4o ground, H1o ground (G2 side), W6o supply, G2o supply
		//        (no return, no current) -> (4 + 4)/4 = 2. D supply x4 -> 4.
		// Least: on, C, 2.
		says: 'The pilot lamp on the switch lights, but the heater does nothing.',
		circuit: HEATER,
		observe: 'on: L1=on, H1=off',
		candidates: ['open:W4', 'open:W6', 'open:H1', 'open:G2'],
		next_test: {
			state: 'on',
			point: 'C',
			expected_left: 2,
			outcomes: { ground: ['open:W4', 'open:H1'], supply: ['open:W6', 'open:G2'] }
		}
	},
	{
		// "on: L1=off, H1=on": an open in the lamp's branch: open:W3, open:W5, open:L1, open:G1.
		// (high-resistance on W3/W5 leaves L1 on at 97 %; shorted:L1 blows F1 and stops H1.)
		// No labelled point is in the lamp branch: off A, B, C ground and D supply for all four; on A,
		// B, D supply and C ground for all four. Every point leaves 4 -> the first by state, then
		// point order: off, A (all ground).
		says: 'The heater blows warm, but the little lamp on the switch never comes on.',
		circuit: HEATER,
		observe: 'on: L1=off, H1=on',
		candidates: ['open:W3', 'open:W5', 'open:L1', 'open:G1'],
		next_test: {
			state: 'off',
			point: 'A',
			expected_left: 4,
			outcomes: { ground: ['open:W3', 'open:W5', 'open:L1', 'open:G1'] }
		}
	},
	{
		// "on: L1=off, H1=off, F1=ok": no feed past the switch and the fuse not blown: open:W1, open:W2,
		// open:S1 (open:F1 reads blown; shorts after the fuse blow it; 1 ohm leaves both weak).
		// Reads (W1o, W2o, S1o): off D (S1.1): W1o floating (F1 and S1.1 cut from B+, S1 open), W2o
		// floating (S1.1 with W2's far half), S1o supply -> (4 + 1)/3 = 5/3. off A, B, C ground x3 -> 3.
		// on D: W1o, W2o ground (through the closed switch and the loads), S1o supply -> 5/3; on A, B,
		// C ground x3 -> 3. Tie 5/3 between off D and on D: state order -> off, D.
		says: 'Nothing works with the switch on, yet the fuse looks fine.',
		circuit: HEATER,
		observe: 'on: L1=off, H1=off, F1=ok',
		candidates: ['open:W1', 'open:W2', 'open:S1'],
		next_test: {
			state: 'off',
			point: 'D',
			expected_left: 5 / 3,
			outcomes: { floating: ['open:W1', 'open:W2'], supply: ['open:S1'] }
		}
	},
	{
		// "off: F1=ok; on: F1=blown": a short that only carries current once S1 closes:
		// short-to-ground on W3, W4 (after S1), shorted:L1, shorted:H1. (W2's short blows F1 with S1
		// open too; open:F1 reads blown in both states.)
		// Reads: off A, B, C ground (the short or the 0.01 ohm load ties them to GND), D supply; on all
		// ground (fuse open): the same for all four everywhere -> 16/4 = 4 at every point; first: off, A.
		says: 'The fuse is fine until the heater is switched on; then it blows at once.',
		circuit: HEATER,
		observe: 'off: F1=ok; on: F1=blown',
		candidates: ['short-to-ground:W3', 'short-to-ground:W4', 'shorted:L1', 'shorted:H1'],
		next_test: {
			state: 'off',
			point: 'A',
			expected_left: 4,
			outcomes: { ground: ['short-to-ground:W3', 'short-to-ground:W4', 'shorted:L1', 'shorted:H1'] }
		}
	},
	{
		// "on: H1=weak": 1 ohm in the heater's path: high-resistance on W1, W2 (shared feed: 3.908 A),
		// W4, W6 (heater branch: 4.0 A). Not W3/W5 (lamp branch).
		// Reads on: A (S1.2): W1, W2 partial (7.816 V); W4, W6 supply (11.996 V) -> (4 + 4)/4 = 2.
		//   B (H1.1): W1, W2 partial; W4 partial (4.0 A x 2 ohm = 7.997 V); W6 supply -> (9 + 1)/4 = 2.5.
		//   C (H1.2): W6 partial (4.0 A x 1 ohm = 3.999 V), others ground -> 2.5.
		//   D (S1.1): W1, W2 partial, W4, W6 supply -> 2.
		// off: no current, A, B, C ground and D supply for all -> 4. Least 2: on A before on D.
		says: 'The heater only gets lukewarm.',
		circuit: HEATER,
		observe: 'on: H1=weak',
		candidates: ['high-resistance:W1', 'high-resistance:W2', 'high-resistance:W4', 'high-resistance:W6'],
		next_test: {
			state: 'on',
			point: 'A',
			expected_left: 2,
			outcomes: {
				partial: ['high-resistance:W1', 'high-resistance:W2'],
				supply: ['high-resistance:W4', 'high-resistance:W6']
			}
		}
	},
	{
		// "on: M1=off, K1=released": the coil loop is broken or its fuse gone: open:W1, open:W2,
		// short-to-ground:W2, open:W3, open:W4, open:F1, open:K1.coil, shorted:K1.coil, open:S1, open:G1.
		// B, C, D: relay released in both states -> ground for all 10 (load side through M1 to G2) -> 10.
		// A (K1.85), off: W1o, W2o, F1o, coil-open floating (coil loop cut from B+ and S1 open) = 4;
		//   stg W2 ground (F1 blown, K1.85 through the coil to the short) = 1; W3o, W4o, shorted coil,
		//   S1o, G1o supply (fed through the coil, no current) = 5 -> (16 + 1 + 25)/10 = 4.2.
		// A, on: W1o, W2o, stgW2, F1o, coil-open, shorted coil ground (through S1) = 6; W3o, W4o, S1o,
		//   G1o supply = 4 -> 5.2. Least: off, A.
		says: 'Switched on, the fan never runs and the relay never clicks.',
		circuit: FAN,
		observe: 'on: M1=off, K1=released',
		candidates: [
			'open:W1',
			'open:W2',
			'short-to-ground:W2',
			'open:W3',
			'open:W4',
			'open:F1',
			'open:K1.coil',
			'shorted:K1.coil',
			'open:S1',
			'open:G1'
		],
		next_test: {
			state: 'off',
			point: 'A',
			expected_left: 4.2,
			outcomes: {
				floating: ['open:W1', 'open:W2', 'open:F1', 'open:K1.coil'],
				ground: ['short-to-ground:W2'],
				supply: ['open:W3', 'open:W4', 'shorted:K1.coil', 'open:S1', 'open:G1']
			}
		}
	},
	{
		// "on: K1=energized, M1=off": load loop broken or F2 gone: open:W5, open:W6,
		// short-to-ground:W6, open:FEED, short-to-ground:FEED, open:W8, open:F2, open:K1.87, open:M1,
		// shorted:M1, open:G2 (11). A reads the same for all (off supply, on ground) -> 11.
		// off (released): B ground for W5o, W6o, stgW6, stgFEED, F2o, 87o, shM1 (7); floating for FEEDo
		//   (K1.87 with FEED's first half), W8o, M1o, G2o (4) -> (49 + 16)/11 = 65/11.
		//   C: floating W8o, M1o, G2o; ground 8 -> 73/11. D: floating W8o, G2o; ground 9 -> 85/11.
		// on (energized): B supply for FEEDo, W8o, M1o, G2o, ground 7 -> 65/11; C supply W8o, M1o, G2o
		//   -> 73/11; D supply W8o, G2o -> 85/11. Tie 65/11 off B / on B -> state order: off, B.
		says: 'The relay clicks when the fan is switched on, but the fan stays still.',
		circuit: FAN,
		observe: 'on: K1=energized, M1=off',
		candidates: [
			'open:W5',
			'open:W6',
			'short-to-ground:W6',
			'open:FEED',
			'short-to-ground:FEED',
			'open:W8',
			'open:F2',
			'open:K1.87',
			'open:M1',
			'shorted:M1',
			'open:G2'
		],
		next_test: {
			state: 'off',
			point: 'B',
			expected_left: 65 / 11,
			outcomes: {
				ground: [
					'open:W5',
					'open:W6',
					'short-to-ground:W6',
					'short-to-ground:FEED',
					'open:F2',
					'open:K1.87',
					'shorted:M1'
				],
				floating: ['open:FEED', 'open:W8', 'open:M1', 'open:G2']
			}
		}
	},
	{
		// "off: M1=on": short-to-ground:W3 (K1.85 grounded past S1), stuck-closed:K1 (welded),
		// stuck-closed:S1. (A short on W4 sits beside an already grounded wire.)
		// off A (K1.85): stg W3 ground (0.1575 A x 0.01 ohm = 1.6 mV), stuck S1 ground, welded K1
		//   supply (coil unfed, S1 open) -> (4 + 1)/3 = 5/3. B supply, C partial, D ground for all -> 3.
		// on: A ground for all, B, C, D as off -> 3. Least: off, A.
		says: 'The fan runs all the time, even with the switch off.',
		circuit: FAN,
		observe: 'off: M1=on',
		candidates: ['short-to-ground:W3', 'stuck-closed:K1', 'stuck-closed:S1'],
		next_test: {
			state: 'off',
			point: 'A',
			expected_left: 5 / 3,
			outcomes: { ground: ['short-to-ground:W3', 'stuck-closed:S1'], supply: ['stuck-closed:K1'] }
		}
	},
	{
		// "on: M1=weak": 1 ohm in the load loop: high-resistance on W5, W6, FEED, W8 (6.065 A).
		// on B (K1.87): W5, W6 -> 12.6 - 6.065 x 1.001 = 6.529 V partial; FEED, W8 -> 12.594 V supply
		//   -> 2. C (M1.1): W5, W6, FEED 6.065 x 1.05 = 6.368 V partial; W8 6.065 x 2.05 = 12.433 V
		//   supply (0.167 V below 12.6) -> (9 + 1)/4 = 2.5. D (M1.2): W8 6.065 V partial, others ground
		//   -> 2.5. A ground for all -> 4. off: all released, every point the same -> 4. Least: on, B.
		says: 'The fan turns, but slowly.',
		circuit: FAN,
		observe: 'on: M1=weak',
		candidates: ['high-resistance:W5', 'high-resistance:W6', 'high-resistance:FEED', 'high-resistance:W8'],
		next_test: {
			state: 'on',
			point: 'B',
			expected_left: 2,
			outcomes: {
				partial: ['high-resistance:W5', 'high-resistance:W6'],
				supply: ['high-resistance:FEED', 'high-resistance:W8']
			}
		}
	},
	{
		// "off: F2=ok; on: F2=blown": a load-side short that only carries current once the relay
		// pulls in: short-to-ground:FEED, shorted:M1. (W6's short blows F2 while released too.)
		// Reads: off A supply, B, C, D ground for both; on all ground for both -> every point 4/2 = 2;
		// first: off, A.
		says: 'The fan fuse is fine until the fan is switched on, then it blows.',
		circuit: FAN,
		observe: 'off: F2=ok; on: F2=blown',
		candidates: ['short-to-ground:FEED', 'shorted:M1'],
		next_test: {
			state: 'off',
			point: 'A',
			expected_left: 2,
			outcomes: { supply: ['short-to-ground:FEED', 'shorted:M1'] }
		}
	}
];

describe('hand-worked complaints', () => {
	it('the standard lists the working assumes', () => {
		// spec "The standard fault list": wires in file order, then parts in file order
		const heater = standardFaults(parseCircuit(HEATER)).map(formatFault);
		expect(heater.length).toBe(27);
		expect(heater.slice(18)).toEqual([
			'open:F1',
			'open:S1',
			'stuck-closed:S1',
			'open:L1',
			'shorted:L1',
			'open:H1',
			'shorted:H1',
			'open:G1',
			'open:G2'
		]);
		expect(standardFaults(parseCircuit(FAN)).length).toBe(37);
	});

	for (const c of COMPLAINTS) {
		it(`"${c.says}" (${c.observe})`, () => {
			const d = diagnose(parseCircuit(c.circuit), parseObservations(c.observe));
			expect(d.candidates, 'candidates, standard-list order').toEqual(c.candidates);
			if (c.next_test === null) {
				expect(d.next_test).toBeNull();
				return;
			}
			expect(d.next_test, 'a next test for two or more candidates').not.toBeNull();
			const nt = d.next_test!;
			expect({ state: nt.state, point: nt.point }).toEqual({ state: c.next_test.state, point: c.next_test.point });
			expect(Math.abs(nt.expected_left - c.next_test.expected_left), `expected_left ${nt.expected_left}`).toBeLessThanOrEqual(1e-3);
			expect(nt.outcomes).toEqual(c.next_test.outcomes);
		});
	}

	it('at least 10 complaints', () => {
		expect(COMPLAINTS.length).toBeGreaterThanOrEqual(10);
	});
});
