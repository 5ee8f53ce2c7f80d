export { ridgeLineRing } from './ridgeLineRing';
export { footbridgeFrame, footbridgeFrameWithExtraDiagonal } from './footbridgeFrame';
export { weatherStationRing, weatherStationRingConsistent } from './weatherStationRing';
export { demoModels, type DemoModel } from './demoModels';
export { weatherStationReadings, demoReadingsModelNames } from './weatherStationReadings';
