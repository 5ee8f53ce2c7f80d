/**
 * What a mesh kit result can and cannot say, by coefficient field. Over
 * GF(2) every closed surface has b₂ = 1; over the rationals a closed
 * non-orientable one has b₂ = 0 (Hatcher 2002, ch. 2 and §3.1: the Klein
 * bottle gives 1, 2, 1 over GF(2) and 1, 1, 0 over the rationals).
 */
export function meshCaution(field: string): string {
  const common = 'orientability is a combinatorial check of the triangles.';
  if (field === 'rational')
    return `Betti numbers are exact (computed over the rationals); ${common} Over the rationals a closed piece encloses a void only if it is orientable: a non-orientable one has b₂ = 0, and its twist is torsion that rational Betti numbers do not count.`;
  return `Betti numbers are exact (computed over GF(2)); ${common} Over GF(2) a closed piece always encloses one void, orientable or not.`;
}
