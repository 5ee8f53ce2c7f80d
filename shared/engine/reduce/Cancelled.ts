/** Thrown when the caller asked a long computation to stop. */
export class Cancelled extends Error {
  constructor(message = 'computation cancelled') {
    super(message);
    this.name = 'Cancelled';
  }
}

/** Hooks a long computation calls now and then: report progress, and stop if asked. */
export interface Control {
  /** phase name and fraction done in [0, 1] */
  progress?(phase: string, fraction: number): void;
  /** return true to abandon the computation with {@link Cancelled} */
  shouldStop?(): boolean;
}

export function checkpoint(control: Control | undefined, phase: string, fraction: number): void {
  if (!control) return;
  control.progress?.(phase, fraction);
  if (control.shouldStop?.()) throw new Cancelled();
}
