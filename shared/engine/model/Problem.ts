/** A located, human-readable defect in user input. */
export interface Problem {
  /** Where in the input: a JSON path such as `maps.entries[3]`, or a cell. */
  where: string;
  message: string;
}

export function formatProblem(p: Problem): string {
  return p.where ? `${p.where}: ${p.message}` : p.message;
}

/** Thrown at a boundary when input is invalid; carries every problem found. */
export class ModelError extends Error {
  readonly problems: Problem[];
  constructor(problems: Problem[]) {
    super(problems.length ? formatProblem(problems[0]) : 'invalid input');
    this.name = 'ModelError';
    this.problems = problems;
  }
}

/** Collects problems, stopping the caller early once there are too many to be useful. */
export class ProblemList {
  readonly items: Problem[] = [];
  constructor(readonly limit = 50) {}
  add(where: string, message: string): void {
    if (this.items.length < this.limit) this.items.push({ where, message });
  }
  get full(): boolean {
    return this.items.length >= this.limit;
  }
  get any(): boolean {
    return this.items.length > 0;
  }
}
