// The invented demo data of shared/kits/demo, bundled as text so the kits work offline.
import ridgeLines from '../../shared/kits/demo/ridge-line-lines.csv?raw';
import ridgeStations from '../../shared/kits/demo/ridge-line-stations.csv?raw';
import footbridgeBars from '../../shared/kits/demo/footbridge-bars.csv?raw';
import footbridgeBarsExtra from '../../shared/kits/demo/footbridge-bars-extra-diagonal.csv?raw';
import footbridgeJoints from '../../shared/kits/demo/footbridge-joints.csv?raw';
import culvertRing from '../../shared/kits/demo/culvert-ring.obj?raw';

export interface NamedText {
  name: string;
  text: string;
}

export const DEMO = {
  stations: { name: 'ridge-line-stations.csv', text: ridgeStations },
  lines: { name: 'ridge-line-lines.csv', text: ridgeLines },
  joints: { name: 'footbridge-joints.csv', text: footbridgeJoints },
  bars: { name: 'footbridge-bars.csv', text: footbridgeBars },
  barsExtra: { name: 'footbridge-bars-extra-diagonal.csv', text: footbridgeBarsExtra },
  mesh: { name: 'culvert-ring.obj', text: culvertRing },
} satisfies Record<string, NamedText>;

/** The a-priori σ0 (mm per √km) the ridge-line demo is tested with: invented, like its data. */
export const DEMO_LEVELLING_SIGMA0_MM = '3';
