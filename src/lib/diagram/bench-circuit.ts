/**
 * A generated 40-part circuit of our own (two relay circuits, six switched lamp columns, a 5 V reference
 * through a connector): the diagram benchmark's workload (scripts/bench-diagram.ts) and the largest case
 * of the layout's geometry tests (layout.test.ts).
 */
export function benchCircuit(): string {
	const parts: string[] = [];
	const wires: string[] = [];
	const points: string[] = [];
	for (const i of [1, 2]) {
		parts.push(
			`  FC${i}: { type: fuse, amps: 10 }`,
			`  FL${i}: { type: fuse, amps: 30 }`,
			`  K${i}: { type: relay }`,
			`  SC${i}: { type: switch }`,
			`  M${i}: { type: motor, amps: 12 }`,
			`  GK${i}: { type: ground }`
		);
		wires.push(`  - B+ FC${i}.1`, `  - FC${i}.2 K${i}.86`, `  - K${i}.85 SC${i}.1`, `  - SC${i}.2 GK${i}`, `  - B+ FL${i}.1`, `  - FL${i}.2 K${i}.30`, `  - K${i}.87 M${i}.1`, `  - M${i}.2 GK${i}`);
		points.push(`  K${i}A: K${i}.85`, `  K${i}B: K${i}.87`);
	}
	for (let i = 1; i <= 6; i++) {
		parts.push(`  F${i}: { type: fuse, amps: 10 }`, `  S${i}: { type: switch }`, `  L${i}: { type: lamp, watts: 21 }`, `  G${i}: { type: ground }`);
		wires.push(`  - B+ F${i}.1`, `  - F${i}.2 S${i}.1`, `  - { from: S${i}.2, to: L${i}.1, color: GN/WH }`, `  - L${i}.2 G${i}`);
		points.push(`  P${i}: L${i}.1`);
	}
	parts.push(`  U1: { type: supply, volts: 5 }`, `  C1: { type: connector, cavities: 2 }`, `  RT1: { type: resistor, ohms: 2500 }`, `  GU1: { type: ground }`);
	wires.push(`  - U1.+ C1.1a`, `  - C1.1b RT1.1`, `  - RT1.2 C1.2b`, `  - C1.2a GU1`, `  - U1.- GND`);
	points.push(`  REF: C1.1b`);
	const text = ['id: bench-forty', 'title: Forty-part bench circuit', 'supply: 12.6', 'parts:', ...parts, 'wires:', ...wires, 'points:', ...points, 'states:', '  all-on: { SC1: closed, SC2: closed, S1: closed, S2: closed, S3: closed, S4: closed, S5: closed, S6: closed }'].join('\n');
	return text + '\n';
}
