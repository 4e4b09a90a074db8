/**
 * Splicepoint circuit engine: the one public entry. Pure TypeScript (only `yaml` and `zod`), safe to
 * run in the browser. Units: volts (V), amps (A), ohms (Ω). See /work/shared/spec/circuit-format.md.
 */
export { CircuitFileError, DeadShortError, FaultError, ObservationError, SolveOptionError, formatProblem } from './errors';
export type { Problem } from './errors';
export type { Circuit, Part, PartType, Wire, CircuitState } from './model';
export { PART_TYPES } from './model';
export { parseCircuit, checkCircuitText } from './circuit-file';
export { parseFault, formatFault, standardFaults, applyFault } from './faults';
export type { Fault, FaultKind } from './faults';
export type {
	Reads,
	WhatIf,
	SolveOptions,
	SolveResult,
	DeadShortResult,
	LinearNetwork,
	ElementCurrent,
	Observation,
	Diagnosis
} from './types';
export { solveCircuit, solveDetailed, settledNetwork } from './solve';
export { tracePath, sharedPath } from './paths';
export { parseObservations } from './observations';
export { diagnose } from './diagnose';
export { explainSolve } from './explain';
export type { Explanation, DropExplanation, PointExplanation, FuseExplanation, RelayExplanation, PathExplanation } from './explain';
export type { SettleEvent } from './settle';
export { meterReading } from './readings';
