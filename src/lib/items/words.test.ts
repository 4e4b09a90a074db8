// Fault words and display rounding for learner-facing text. The rounding is our display rule (meters in the
// trade show volts to hundredths: common practice); these tests pin what a learner reads.
import { describe, expect, it } from 'vitest';
import { parseCircuit } from '../circuit';
import { faultText, faultWords, namesWire, tidyNumbers } from './words';

describe('tidyNumbers', () => {
	it('rounds amps and watts to 3 significant figures and volts and ohms to 2 decimals', () => {
		expect(tidyNumbers('F1 opened: 308.6478 A through it, above its 15 A rating')).toBe('F1 opened: 309 A through it, above its 15 A rating');
		expect(tidyNumbers('4.3915 A (±0.0878 A)')).toBe('4.39 A (±0.0878 A)');
		expect(tidyNumbers('0.012345 A')).toBe('0.0123 A');
		expect(tidyNumbers('K1 is energized: 12.449 V on its coil, at or above its 7 V pull-in')).toBe('K1 is energized: 12.45 V on its coil, at or above its 7 V pull-in');
		expect(tidyNumbers('55.55555 W and 0.33333 Ω')).toBe('55.6 W and 0.33 Ω');
		expect(tidyNumbers('12.30 V')).toBe('12.30 V');
		expect(tidyNumbers('-0.0004 V')).toBe('0.00 V');
		expect(tidyNumbers('12.3456 mA')).toBe('12.3 mA');
	});
	it('leaves numbers without a unit, whole numbers and ids alone', () => {
		expect(tidyNumbers('W3 at 12 V, seed 1.23456, 3.14159 Amps')).toBe('W3 at 12 V, seed 1.23456, 3.14159 Amps');
	});
});

describe('faultWords', () => {
	const circuit = parseCircuit(`id: words-test
title: One lamp
supply: 12.6
parts:
  F1: { type: fuse, amps: 10 }
  L1: { type: lamp, watts: 21 }
  G1: { type: ground }
wires:
  - { id: W1, from: B+, to: F1.1 }
  - { id: W2, from: F1.2, to: L1.1 }
  - { id: W3, from: L1.2, to: G1 }
`);
	it('names faults in words from the circuit alone', () => {
		expect(faultWords({ circuit }, 'open:W2')).toBe('an open in wire W2');
		expect(faultWords({ circuit }, 'high-resistance:G1:0.5')).toBe('0.5 Ω of corrosion at ground G1');
		expect(faultWords({ circuit }, 'open:F1')).toBe('fuse F1 open');
	});
	it('falls back to the fault as written when there is no circuit or the fault does not parse', () => {
		expect(faultText({ circuit }, 'open:W2')).toBe('an open in wire W2');
		expect(faultText(null, 'open:W2')).toBe('open:W2');
		expect(faultText({ circuit }, 'melted:W2')).toBe('melted:W2');
	});
	it('tells when a text names a wire by id', () => {
		expect(namesWire('an open in wire W11')).toBe(true);
		expect(namesWire('0.5 Ω at ground G1; 12 W lamp; SW3 closed')).toBe(false);
	});
});
