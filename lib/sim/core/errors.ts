// Typed errors of the engine. An InputError names the model entry and the field at fault
// so that a person can find it: `C12.dist.high: must be greater than low (got 5 ≤ 10)`.

export class InputError extends Error {
  constructor(
    /** Label of the entry at fault: an input id such as "C12", or a path such as "items[3] (C4)". */
    readonly where: string,
    /** Dotted field inside the entry, e.g. "dist.high"; empty when the entry as a whole is wrong. */
    readonly field: string,
    /** What is wrong, without the location. */
    readonly problem: string,
  ) {
    super(`${field ? `${where}.${field}` : where}: ${problem}`);
    this.name = 'InputError';
  }
}

/** Thrown by runSimulation when its AbortSignal fires. */
export class SimulationCancelledError extends Error {
  constructor() {
    super('The simulation was cancelled.');
    this.name = 'AbortError';
  }
}

/** A model that failed validation; `issues` holds one message per offending entry. */
export class ModelValidationError extends Error {
  constructor(readonly issues: { path: string; message: string }[]) {
    super(issues.map((i) => (i.path ? `${i.path}: ${i.message}` : i.message)).join('\n'));
    this.name = 'ModelValidationError';
  }
}
