/** A joint of a pin-jointed frame; `fixed[a]` holds axis a (x, y, z) by a support. */
export interface Joint {
  id: string;
  position: number[];
  fixed: boolean[];
  /** Line of the joints file it came from (for messages). */
  line: number;
}

export interface Bar {
  id: string;
  from: string;
  to: string;
  line: number;
}

/** A validated frame in the plane (d = 2) or in space (d = 3). */
export interface Frame {
  dimension: 2 | 3;
  joints: Joint[];
  bars: Bar[];
}

export const AXES = ['x', 'y', 'z'] as const;
