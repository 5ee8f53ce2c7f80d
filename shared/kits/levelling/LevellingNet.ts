/** A station of a levelling net; `height` (metres) is given only for fixed benchmarks. */
export interface Station {
  id: string;
  height: number | undefined;
  /** Line of the stations file it came from (for messages). */
  line: number;
}

/** One levelled line: `rise` = observed height of `to` minus height of `from`, metres. */
export interface LevelLine {
  from: string;
  to: string;
  rise: number;
  lengthKm: number;
  line: number;
}

/** A validated levelling net: every line joins two listed stations, every station reaches a benchmark. */
export interface LevellingNet {
  stations: Station[];
  lines: LevelLine[];
}
