/**
 * A blower motor with speeds set by a positioned switch and dropping resistors: the lower speeds run
 * through one or two resistors in series, the top speed bypasses them.
 */
import { CircuitWriter } from './builder';
import { GROUND_COLORS, REST_VOLTS, fuseFor, num, type Family } from './family';

export const twoSpeedBlower: Family = {
	id: 'two-speed-blower',
	title: 'Blower speeds through dropping resistors',
	area: 'motors-body',
	skills: { reading: 'motor-speeds', status: 'motor-speeds', current: 'motor-speeds', drop: 'motor-speeds', works: 'motor-speeds', claims: 'motor-speeds' },
	variant(rng) {
		const supply = rng.pick(REST_VOLTS);
		const amps = rng.pick([8, 10, 12, 14, 16]);
		const r1 = rng.pick([0.3, 0.4, 0.5, 0.6, 0.8, 1, 1.2]);
		const three = rng.next() < 0.5;
		const r2 = rng.pick([0.3, 0.5, 0.7, 1]);
		const hr = rng.pick([0.2, 0.3, 0.5, 1]);
		const w = new CircuitWriter('two-speed-blower', three ? 'Three-speed blower with dropping resistors' : 'Two-speed blower with a dropping resistor', supply);
		w.part('F1', `type: fuse, amps: ${fuseFor(amps)}`);
		w.part('S1', three ? 'type: switch, positions: { off: [], low: ["B-L"], medium: ["B-M"], high: ["B-H"] }' : 'type: switch, positions: { off: [], low: ["B-L"], high: ["B-H"] }');
		w.part('R1', `type: resistor, ohms: ${num(r1)}`);
		if (three) w.part('R2', `type: resistor, ohms: ${num(r2)}`);
		w.part('SP1', 'type: splice');
		w.part('M1', `type: motor, amps: ${num(amps)}`);
		w.part('G1', 'type: ground');
		w.wire('B+', 'F1.1', { color: 'RD' });
		w.wire('F1.2', 'S1.B', { color: 'RD/YE' });
		const low = w.wire('S1.L', 'R1.1', { color: 'BU/WH' });
		let mid = '';
		if (three) {
			w.wire('R1.2', 'R2.1', { color: 'BU/BK' });
			mid = w.wire('S1.M', 'R2.1', { color: 'BU/GN' });
			w.wire('R2.2', 'SP1', { color: 'BU' });
		} else w.wire('R1.2', 'SP1', { color: 'BU' });
		const high = w.wire('S1.H', 'SP1', { color: 'BU/RD' });
		const feed = w.wire('SP1', 'M1.1', { color: 'BU', gauge_mm2: 2.5, length_m: rng.pick([0.5, 1, 1.5]) });
		const gnd = w.wire('M1.2', 'G1', { color: rng.pick(GROUND_COLORS) });
		w.point('A', 'S1.B');
		w.point('B', 'R1.1');
		w.point('C', 'M1.1');
		w.point('D', 'M1.2');
		w.state('off', 'S1: off');
		w.state('low', 'S1: low');
		if (three) w.state('medium', 'S1: medium');
		w.state('high', 'S1: high');
		const faults = ['open:R1', `open:${low}`, `open:${high}`, `open:${feed}`, `open:${gnd}`, 'open:M1', `high-resistance:G1:${hr}`, `short-to-ground:${feed}`, 'shorted:R1'];
		if (three) faults.push('open:R2', `open:${mid}`);
		const states: Record<string, string> = { off: 'the blower switch off', low: 'the blower switch on low', high: 'the blower switch on high' };
		if (three) states.medium = 'the blower switch on medium';
		return {
			params: { supply, amps, r1, three, r2, hr },
			circuit: w.text(),
			title: `**${three ? 'Three' : 'Two'}-speed blower** (${supply} V battery; motor M1 rated ${amps} A; R1 ${r1} Ω${three ? `, R2 ${r2} Ω` : ''}).`,
			states,
			work: 'low',
			rest: 'high',
			loads: ['M1'],
			faults,
			shared: ['R1', 'M1'],
			drop: { from: 'B', to: three ? 'R2.1' : 'C', state: 'low', fault: null, words: three ? 'across resistor R1' : 'across the dropping resistor' },
			watch: ['M1']
		};
	}
};
