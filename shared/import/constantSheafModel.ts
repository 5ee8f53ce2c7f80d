import { MODEL_FORMAT, MODEL_VERSION, type ModelFile, type VertexInfo } from '../engine';
import type { ImportOptions } from './ImportResult';

/**
 * The model file of the constant sheaf (every stalk `stalkDim`, every
 * restriction the identity) on the closure of `simplices`.
 * Throws RangeError on a stalk dimension that is not a non-negative integer:
 * options come from code, not from the file.
 */
export function constantSheafModel(simplices: number[][], options: ImportOptions = {}, vertices?: VertexInfo[]): ModelFile {
  const { name, field, stalkDim = 1 } = options;
  if (!Number.isSafeInteger(stalkDim) || stalkDim < 0) {
    throw new RangeError(`stalkDim must be a non-negative integer, got ${stalkDim}`);
  }
  if (name !== undefined && typeof name !== 'string') throw new TypeError('name must be a string');
  const model: ModelFile = {
    format: MODEL_FORMAT,
    version: MODEL_VERSION,
    field: field ?? { kind: 'rational' },
    simplices,
    stalks: { default: stalkDim },
    maps: { default: 'identity' },
  };
  if (name !== undefined) model.name = name;
  if (vertices) model.vertices = vertices;
  return model;
}
