import type { ModelFile, Problem } from '../../shared/engine';
import { evaluateEntry } from './evaluateEntry';

/** The editable part of a model, as text the way a person types it. */
export interface Draft {
  fieldKind: 'rational' | 'prime' | 'real';
  p: string;
  tolerance: string;
  stalkDefault: string;
  stalkCells: { cell: string; dim: string }[];
  mapDefault: 'identity' | 'zero';
  entries: { face: string; coface: string; kind: 'matrix' | 'scalar'; text: string }[];
}

export function draftOf(model: ModelFile): Draft {
  const f = model.field ?? { kind: 'rational' };
  return {
    fieldKind: f.kind,
    p: f.kind === 'prime' ? String(f.p) : '32003',
    tolerance: f.kind === 'real' && f.tolerance !== undefined ? String(f.tolerance) : '1e-9',
    stalkDefault: String(model.stalks?.default ?? 1),
    stalkCells: (model.stalks?.cells ?? []).map((c) => ({ cell: c.cell.join(', '), dim: String(c.dim) })),
    mapDefault: model.maps?.default ?? 'identity',
    entries: (model.maps?.entries ?? []).map((e) =>
      'matrix' in e
        ? { face: e.face.join(', '), coface: e.coface.join(', '), kind: 'matrix' as const, text: e.matrix.map((row) => row.join(', ')).join('; ') }
        : { face: e.face.join(', '), coface: e.coface.join(', '), kind: 'scalar' as const, text: String(e.scalar) },
    ),
  };
}

/** Build the model file from a draft, or the problems that stop it (located by row and column). */
export function modelOf(base: ModelFile, d: Draft): { model: ModelFile; problems: [] } | { model?: undefined; problems: Problem[] } {
  const problems: Problem[] = [];
  const exactField = d.fieldKind !== 'real';
  const ids = (text: string, where: string) => {
    const parts = text.split(/[\s,]+/).filter(Boolean);
    const nums = parts.map(Number);
    if (parts.length === 0 || nums.some((n) => !Number.isSafeInteger(n) || n < 0)) {
      problems.push({ where, message: `"${text}" is not a list of vertex ids` });
      return [];
    }
    return nums;
  };
  const field: ModelFile['field'] =
    d.fieldKind === 'prime' ? { kind: 'prime', p: Number(d.p) } : d.fieldKind === 'real' ? { kind: 'real', tolerance: Number(d.tolerance) } : { kind: 'rational' };
  const stalkCells = d.stalkCells.map((c, i) => ({ cell: ids(c.cell, `stalk row ${i + 1}, cell`), dim: Number(c.dim) }));
  const entries = d.entries.map((e, i) => {
    const where = `map row ${i + 1}`;
    const face = ids(e.face, `${where}, face`);
    const coface = ids(e.coface, `${where}, coface`);
    const read = (t: string, col: string) => {
      const v = evaluateEntry(t, exactField);
      if ('error' in v) {
        problems.push({ where: `${where}, ${col}`, message: v.error });
        return 0;
      }
      return v.value;
    };
    if (e.kind === 'scalar') return { face, coface, scalar: read(e.text, 'scalar') };
    const rows = e.text.split(';').map((r) => r.trim());
    const matrix = rows.map((r, ri) => r.split(/[\s,]+/).filter(Boolean).map((t, ci) => read(t, `entry (${ri + 1}, ${ci + 1})`)));
    return { face, coface, matrix };
  });
  if (problems.length) return { problems };
  const model: ModelFile = {
    ...base,
    field,
    stalks: { default: Number(d.stalkDefault), ...(stalkCells.length ? { cells: stalkCells } : {}) },
    maps: { default: d.mapDefault, ...(entries.length ? { entries } : {}) },
  };
  return { model, problems: [] };
}
