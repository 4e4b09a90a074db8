/**
 * Circuit texts shared by the engine's own tests.
 */

/** The spec's own example circuit (circuit-format.md, "Example"). */
export const FAN = `id: fan-relay-ground-switched
supply: 12.6
parts:
  F1: { type: fuse, amps: 10 }
  F2: { type: fuse, amps: 30 }
  K1: { type: relay }
  S1: { type: switch }
  M1: { type: motor, amps: 14 }
  G1: { type: ground }
  G2: { type: ground }
wires:
  - B+ F1.1
  - F1.2 K1.86
  - K1.85 S1.1
  - S1.2 G1
  - B+ F2.1
  - F2.2 K1.30
  - { from: K1.87, to: M1.1, id: FAN_FEED, gauge_mm2: 2.5, length_m: 1.5, color: GN/WH }
  - M1.2 G2
points:
  A: K1.85
  B: K1.87
  C: M1.2
states:
  off: { S1: open }
  on:  { S1: closed }
`;


/** A relay-switched lamp of our own, with points on both ends of the lamp feed and at the coil's ground side. */
export const LAMP_RELAY = `supply: 12.6
parts:
  F1: { type: fuse, amps: 10 }
  K1: { type: relay }
  S1: { type: switch }
  L1: { type: lamp, watts: 21 }
  G1: { type: ground }
wires:
  - B+ F1.1
  - F1.2 S1.1
  - S1.2 K1.86
  - K1.85 G1
  - F1.2 K1.30
  - K1.87 L1.1
  - L1.2 G1
points:
  A: K1.87
  B: L1.1
  C: L1.2
  E: K1.85
states:
  off: {}
  on: { S1: closed }
`;
