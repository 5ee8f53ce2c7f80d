import type { SimplicialComplex } from '../complex/SimplicialComplex';
import type { Field } from '../fields/Field';
import type { FieldSpec } from '../fields/FieldSpec';
import type { Mat } from '../based/Mat';
import type { VertexInfo } from './ModelFile';

/**
 * A validated cellular sheaf on a simplicial complex.
 *
 * `restriction[k][e]` names the map F(face ◁ coface) of incidence e of
 * `complex.faces[k]` as an index into `maps` (rows = coface stalk, columns =
 * face stalk), or -1 for a zero map. Shared maps (the identity default) are
 * stored once, so a million-cell constant sheaf holds a handful of matrices.
 */
export interface Sheaf<E> {
  readonly name: string | undefined;
  readonly fieldSpec: FieldSpec;
  readonly field: Field<E>;
  readonly complex: SimplicialComplex;
  readonly stalkDims: Int32Array[];
  readonly restriction: Int32Array[];
  readonly maps: Mat<E>[];
  readonly vertices: VertexInfo[] | undefined;
}
