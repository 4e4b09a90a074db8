/**
 * A module's 5 V reference feeds a temperature sensor through a pull-up resistor and a connector; the
 * module reads the signal between the two. The sensor ground returns through the same connector.
 */
import { CircuitWriter } from './builder';
import { REST_VOLTS, num, type Family } from './family';

export const sensorReference: Family = {
	id: 'sensor-reference',
	title: 'Sensor on a 5 V reference through a connector',
	area: 'sensors-inputs',
	skills: { reading: 'sensor-reference', status: 'sensor-reference', current: 'sensor-reference', drop: 'sensor-signal-faults', works: 'sensor-reference', claims: 'sensor-signal-faults' },
	weight: 1.8,
	variant(rng) {
		const supply = rng.pick(REST_VOLTS);
		const ref = rng.pick([4.9, 5, 5, 5.1]);
		const pull = rng.pick([1000, 1500, 2200, 2700, 3300, 4700]);
		const cold = rng.pick([6000, 8000, 9000, 12000]);
		const warm = rng.pick([2000, 2500, 3000]);
		const hot = rng.pick([200, 300, 400, 600]);
		const hr = rng.pick([100, 200, 300, 500, 1000]);
		const w = new CircuitWriter('sensor-reference', 'Temperature sensor on a 5 V reference', supply);
		w.part('U1', `type: supply, volts: ${num(ref)}`);
		w.part('R1', `type: resistor, ohms: ${pull}`);
		w.part('C1', 'type: connector, cavities: 2');
		w.part('RT1', `type: resistor, ohms: ${warm}`);
		w.part('G1', 'type: ground');
		w.part('G2', 'type: ground');
		w.wire('U1.+', 'R1.1', { color: 'VT' });
		const sig = w.wire('R1.2', 'C1.1a', { id: 'SIG', color: 'YE/BU' });
		const sig2 = w.wire('C1.1b', 'RT1.1', { color: 'YE/BU' });
		const rtg = w.wire('RT1.2', 'C1.2b', { color: 'BN/WH' });
		const sg = w.wire('C1.2a', 'G1', { id: 'SENSOR_GND', color: 'BN/WH' });
		w.wire('U1.-', 'G2', { color: 'BK' });
		w.point('A', 'U1.+');
		w.point('B', 'C1.1a');
		w.point('C', 'C1.1b');
		w.point('D', 'RT1.2');
		w.point('E', 'C1.2a');
		w.state('cold', `RT1: { ohms: ${cold} }`);
		w.state('warm', `RT1: { ohms: ${warm} }`);
		w.state('hot', `RT1: { ohms: ${hot} }`);
		const faults = ['open:C1.1', 'open:C1.2', `high-resistance:C1.2:${hr}`, `high-resistance:C1.1:${hr}`, `open:${sig}`, `short-to-ground:${sig}`, `open:${sig2}`, `open:${rtg}`, `open:${sg}`, `high-resistance:G1:${hr}`, 'open:RT1', 'shorted:RT1'];
		return {
			params: { supply, ref, pull, cold, warm, hot, hr },
			circuit: w.text(),
			title: `**Coolant temperature sensor on a ${ref} V reference** (pull-up R1 ${pull} Ω inside the module; sensor RT1 ${cold} Ω cold, ${warm} Ω warm, ${hot} Ω hot; connector C1 at the sensor).`,
			states: { cold: 'the engine cold', warm: 'the engine warm', hot: 'the engine hot' },
			work: 'warm',
			rest: 'hot',
			loads: [],
			faults,
			shared: ['R1', 'RT1'],
			drop: { from: 'D', to: 'E', state: 'warm', fault: `high-resistance:C1.2:${hr}`, words: 'across the sensor ground cavity of C1' },
			watch: ['B'],
			currentPart: 'RT1'
		};
	}
};
