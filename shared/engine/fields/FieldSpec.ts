/** Which coefficients a computation uses, as named in the model file. */
export type FieldSpec =
  | { kind: 'rational' }
  | { kind: 'prime'; p: number }
  | { kind: 'real'; tolerance?: number };

export function fieldLabel(spec: FieldSpec): string {
  return spec.kind === 'prime' ? `prime:${spec.p}` : spec.kind;
}
