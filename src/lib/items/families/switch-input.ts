/**
 * A switch input to a module: a pull-up from the module's reference to the signal, a switch that
 * pulls the signal to ground, and a status LED fed from the same reference.
 */
import { CircuitWriter } from './builder';
import { REST_VOLTS, num, type Family } from './family';

export const switchInput: Family = {
	id: 'switch-input',
	title: 'Switch input to a module on a pull-up',
	area: 'sensors-inputs',
	skills: { reading: 'sensor-reference', status: 'sensor-reference', current: 'sensor-reference', drop: 'sensor-signal-faults', works: 'sensor-reference', claims: 'sensor-signal-faults' },
	weight: 1.8,
	variant(rng) {
		const supply = rng.pick(REST_VOLTS);
		const ref = rng.pick([5, 5, 12]);
		const volts = ref === 12 ? supply : ref;
		const pull = rng.pick([470, 1000, 2200, 4700, 10000]);
		const hr = rng.pick([50, 100, 220, 470, 1000]);
		const what = rng.pick(['door-ajar', 'brake pedal', 'seat belt', 'hood']);
		const connector = rng.next() < 0.6;
		const w = new CircuitWriter('switch-input', `Module input from the ${what} switch`, supply);
		if (ref !== 12) w.part('U1', `type: supply, volts: ${num(ref)}`);
		w.part('R1', `type: resistor, ohms: ${pull}`);
		if (connector) w.part('C1', 'type: connector, cavities: 1');
		w.part('S1', 'type: switch');
		w.part('G1', 'type: ground');
		if (ref !== 12) w.part('G2', 'type: ground');
		const top = ref === 12 ? 'B+' : 'U1.+';
		w.wire(top, 'R1.1', { color: 'VT' });
		const sig = w.wire('R1.2', connector ? 'C1.1a' : 'S1.1', { id: 'SIG', color: 'GN/WH' });
		let sig2 = sig;
		if (connector) sig2 = w.wire('C1.1b', 'S1.1', { color: 'GN/WH' });
		const sg = w.wire('S1.2', 'G1', { color: 'BK' });
		if (ref !== 12) w.wire('U1.-', 'G2', { color: 'BK' });
		w.point('A', top);
		w.point('B', 'R1.2');
		w.point('C', 'S1.1');
		w.point('D', 'S1.2');
		w.state('open', 'S1: open');
		w.state('closed', 'S1: closed');
		const faults = [`open:${sig}`, `short-to-ground:${sig}`, `open:${sg}`, `high-resistance:G1:${hr}`, `high-resistance:${sg}:${hr}`, 'stuck-closed:S1', 'open:S1', 'open:R1'];
		if (connector) faults.push('open:C1.1', `high-resistance:C1.1:${hr}`, `open:${sig2}`);
		return {
			params: { supply, ref, pull, hr, what, connector },
			circuit: w.text(),
			title: `**${what[0].toUpperCase()}${what.slice(1)} switch input** (${volts} V ${ref === 12 ? 'battery feed' : 'module reference'}; pull-up R1 ${pull} Ω; switch S1 to ground${connector ? ' through connector C1' : ''}).`,
			states: { open: 'the switch open', closed: 'the switch closed' },
			work: 'closed',
			rest: 'open',
			loads: [],
			faults,
			shared: null,
			drop: { from: 'D', to: 'GND', state: 'closed', fault: `high-resistance:G1:${hr}`, words: 'across the switch ground' },
			watch: ['B'],
			currentPart: 'R1'
		};
	}
};
