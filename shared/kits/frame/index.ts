export type { Frame, Joint, Bar } from './Frame';
export { readFrameCsv, type ReadFrameResult } from './readFrameCsv';
export { frameSheaf, type FrameSheaf } from './frameSheaf';
export { rigidMotions } from './rigidMotions';
export { analyseFrame, FRAME_CAUTION, type FrameReport } from './analyseFrame';
