/** The model file, version 1, as written on disk (`*.sheaf.json`). */
export interface ModelFile {
  format: 'gluefield.sheaf';
  version: 1;
  name?: string;
  field?: { kind: 'rational' } | { kind: 'prime'; p: number } | { kind: 'real'; tolerance?: number };
  simplices: number[][];
  vertices?: VertexInfo[];
  stalks?: { default?: number; cells?: { cell: number[]; dim: number }[] };
  maps?: {
    default?: 'identity' | 'zero';
    entries?: MapEntry[];
  };
}

export interface VertexInfo {
  id: number;
  x?: number;
  y?: number;
  z?: number;
  label?: string;
}

export type MatrixEntry = number | string;

export type MapEntry =
  | { face: number[]; coface: number[]; matrix: MatrixEntry[][] }
  | { face: number[]; coface: number[]; scalar: MatrixEntry };

export const MODEL_FORMAT = 'gluefield.sheaf';
export const MODEL_VERSION = 1;
