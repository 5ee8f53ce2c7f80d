import type { ReadingsFile } from '../engine';
import { weatherStationRing, weatherStationRingConsistent } from './weatherStationRing';

/**
 * Invented wind readings (m/s, east and north in each station's own
 * horizontal frame) for the weather station ring: one per station WS-01 …
 * WS-06 and one per link, relayed in the frame of the link's later station
 * (weight 0.5: relayed values are trusted less). They follow one wind of
 * (2.40, −1.10) in WS-01's frame carried round by the measured rotations,
 * with a few centimetres per second of noise, except at WS-04, whose two
 * axes were wired the wrong way round: it reads (2.40, 1.10) where the
 * wind was (1.10, 2.40). A check finds WS-04 against both of its links.
 */
export function weatherStationReadings(): ReadingsFile {
  const station = (id: number, value: number[]) => ({ cell: [id], value });
  const link = (a: number, b: number, value: number[]) => ({ cell: [a, b], value, weight: 0.5 });
  return {
    format: 'gluefield.readings',
    version: 1,
    name: 'Wind, week 3 (invented)',
    values: [
      station(0, [2.41, -1.09]),
      station(1, [2.31, 1.27]),
      station(2, [2.62, -0.39]),
      station(3, [2.4, 1.1]),
      station(4, [1.72, 2.0]),
      station(5, [-0.55, 2.57]),
      link(0, 1, [2.33, 1.25]),
      link(1, 2, [2.6, -0.38]),
      link(2, 3, [1.11, 2.41]),
      link(3, 4, [1.74, 1.99]),
      link(4, 5, [-0.57, 2.59]),
      link(0, 5, [-0.56, 2.58]),
    ],
  };
}

/** Names of the demo models the invented readings above belong to. */
export function demoReadingsModelNames(): string[] {
  return [weatherStationRing().name!, weatherStationRingConsistent().name!];
}
