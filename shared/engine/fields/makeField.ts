import type { Field } from './Field';
import type { FieldSpec } from './FieldSpec';
import { primeField } from './primeField';
import { rationalField } from './rationalField';
import { realField } from './realField';

/** The field for a validated spec. Elements are `unknown` to callers that stay generic. */
export function makeField(spec: FieldSpec): Field<unknown> {
  switch (spec.kind) {
    case 'rational':
      return rationalField as Field<unknown>;
    case 'prime':
      return primeField(spec.p) as Field<unknown>;
    case 'real':
      return realField(spec.tolerance) as Field<unknown>;
  }
}
