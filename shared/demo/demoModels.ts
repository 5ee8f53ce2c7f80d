import type { ModelFile } from '../engine';
import { footbridgeFrame, footbridgeFrameWithExtraDiagonal } from './footbridgeFrame';
import { ridgeLineRing } from './ridgeLineRing';
import { weatherStationRing, weatherStationRingConsistent } from './weatherStationRing';

/** One invented demo scenario, under a stable key. */
export interface DemoModel {
  key: string;
  model: ModelFile;
}

/** Every demo scenario, in the order the demo project lists them. Fresh objects on each call. */
export function demoModels(): DemoModel[] {
  return [
    { key: 'ridge-line-ring', model: ridgeLineRing() },
    { key: 'footbridge-frame', model: footbridgeFrame() },
    { key: 'footbridge-frame-extra-diagonal', model: footbridgeFrameWithExtraDiagonal() },
    { key: 'weather-station-ring', model: weatherStationRing() },
    { key: 'weather-station-ring-consistent', model: weatherStationRingConsistent() },
  ];
}
