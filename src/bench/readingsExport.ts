import type { CellRef, ReadingsCheck } from '../compute/readingsService';
import { toCsv } from '../kits/download';

/** A cell as the readings CSV writes it: vertex ids joined by dashes. */
export const cellText = (c: CellRef) => c.ids.join('-');

/** The cell for people: vertex labels when the model has them, else the ids. */
export const cellName = (c: CellRef) => (c.labels ? c.labels.join(' – ') : cellText(c));

/** The whole check as JSON, with where it came from. */
export function checkJson(check: ReadingsCheck, modelName: string): string {
  return JSON.stringify(
    {
      format: 'gluefield.readings-check',
      version: 1,
      model: modelName,
      modelVersion: check.modelVersion,
      modelHash: check.modelHash,
      readings: check.readingsName,
      engineVersion: check.engineVersion,
      checkedAt: new Date(check.createdAt).toISOString(),
      field: check.field,
      arithmetic: 'floating point (64-bit)',
      consistencyRadius: check.radius,
      worstPairs: check.worst.map((p) => ({ face: p.face.ids, coface: p.coface.ids, mismatch: p.mismatch })),
      nearestSection: { ...check.section, readings: check.cells.map((c) => ({ cell: c.cell.ids, weight: c.weight, reading: c.reading, fitted: c.fitted, residual: c.residual, residualNorm: c.norm })) },
      laplacian: { degree: 0, ...check.spectrum },
    },
    null,
    2,
  );
}

/**
 * One table for a spreadsheet: a `reading` row per reading (against the
 * nearest global section) and a `pair` row per worst face pair (its
 * mismatch in `norm`). Cells as in the import format, coordinates joined
 * by semicolons.
 */
export function checkCsv(check: ReadingsCheck): string {
  const join = (v: number[]) => v.join(';');
  const rows: (string | number | null)[][] = [
    ...check.cells.map((c) => ['reading', cellText(c.cell), null, c.weight, join(c.reading), join(c.fitted), join(c.residual), c.norm]),
    ...check.worst.map((p) => ['pair', cellText(p.face), cellText(p.coface), null, null, null, null, p.mismatch]),
  ];
  return toCsv(['kind', 'cell', 'coface', 'weight', 'reading', 'fitted', 'residual', 'norm'], rows);
}
