import type { BasedComplex } from '../based/BasedComplex';
import { copyMat, isZeroMat, mulMat, scalarMat, subInPlace, type Mat } from '../based/Mat';
import { matchedInverses } from './matchedInverses';
import { ALIVE, CRITICAL, GONE, type Matching } from './matchCells';
import type { MorseEntries } from './MorseEntries';
import { Overlay } from './Overlay';

/**
 * The Morse coboundary δ_M^k by replaying a matching's moves in order and
 * eliminating each pair of degree k at once, D ← D − c·B⁻¹·b.
 *
 * The matching only makes a pair when b or c consists of critical cells, so
 * every update lands on an entry with a critical end. Those entries live in
 * an {@link Overlay}; entries between free cells are the input's own. When
 * the replay ends, the overlay holds exactly the Morse coboundary. Cost is
 * proportional to the fill, which suits many critical cells with local flow.
 */
export function replayCoboundary<E>(X: BasedComplex<E>, m: Matching, k: number, pivotRatio: number): MorseEntries<E> {
  const F = X.field;
  const { offset, total, degreeOf, rowOf } = m.index;
  const cob = X.cob[k];
  const rows = rowOf[k];
  const state = new Uint8Array(total);
  for (let g = 0; g < total; g++) if (m.state[g] === GONE && isEmptyCell(X, degreeOf[g], g - offset[degreeOf[g]])) state[g] = GONE;
  const overlay = new Overlay<E>(total);
  const faceCells: number[] = [];
  const faceMats: Mat<E>[] = [];
  const faceSigns: number[] = [];
  const cofaceCells: number[] = [];
  const cofaceMats: Mat<E>[] = [];
  const cofaceSigns: number[] = [];
  const minusOne = F.neg(F.one);
  const inverseOf = matchedInverses(X, pivotRatio);

  const remove = (g: number) => {
    state[g] = GONE;
    overlay.removeCell(g);
  };
  /** A cell turning critical brings its entries with free neighbours into the overlay. */
  const makeCritical = (g: number) => {
    state[g] = CRITICAL;
    if (degreeOf[g] === k) {
      const c = g - offset[k];
      for (let p = cob.colPtr[c]; p < cob.colPtr[c + 1]; p++) {
        const e = cob.colEntry[p];
        const w = offset[k + 1] + rows[e];
        if (cob.block[e] >= 0 && state[w] === ALIVE) overlay.add(g, w, copyMat(F, X.blocks[cob.block[e]], cob.sign[e] < 0 ? minusOne : F.one));
      }
    } else {
      const t = g - offset[k + 1];
      for (let e = cob.rowPtr[t]; e < cob.rowPtr[t + 1]; e++) {
        const a = offset[k] + cob.col[e];
        if (cob.block[e] >= 0 && state[a] === ALIVE) overlay.add(a, g, copyMat(F, X.blocks[cob.block[e]], cob.sign[e] < 0 ? minusOne : F.one));
      }
    }
  };

  const eliminate = (i: number) => {
    const e0 = m.pairEntry[k][i];
    const s = offset[k] + m.pairSigma[k][i];
    const t = offset[k + 1] + m.pairTau[k][i];
    const criticalFaces = overlay.faceTotal(t);
    const criticalCofaces = overlay.cofaceTotal(s);
    if (criticalFaces === 0 && criticalCofaces === 0) {
      // The common case: no critical neighbour, so nothing to update.
      remove(s);
      remove(t);
      return;
    }
    let nf = overlay.faces(t, faceCells, faceMats);
    let nc = overlay.cofaces(s, cofaceCells, cofaceMats);
    for (let j = 0; j < nf; j++) faceSigns[j] = 1;
    for (let j = 0; j < nc; j++) cofaceSigns[j] = 1;
    if (criticalFaces > 0) {
      const c0 = s - offset[k];
      for (let p = cob.colPtr[c0]; p < cob.colPtr[c0 + 1]; p++) {
        const e = cob.colEntry[p];
        const w = offset[k + 1] + rows[e];
        if (cob.block[e] >= 0 && w !== t && state[w] === ALIVE) {
          cofaceCells[nc] = w;
          cofaceSigns[nc] = cob.sign[e];
          cofaceMats[nc++] = X.blocks[cob.block[e]];
        }
      }
    }
    if (criticalCofaces > 0) {
      const r0 = t - offset[k + 1];
      for (let e = cob.rowPtr[r0]; e < cob.rowPtr[r0 + 1]; e++) {
        const a = offset[k] + cob.col[e];
        if (cob.block[e] >= 0 && a !== s && state[a] === ALIVE) {
          faceCells[nf] = a;
          faceSigns[nf] = cob.sign[e];
          faceMats[nf++] = X.blocks[cob.block[e]];
        }
      }
    }
    if (nf > 0 && nc > 0) {
      const Binv = inverseOf(cob.block[e0]);
      const sign = cob.sign[e0];
      for (let a0 = 0; a0 < nf; a0++) {
        const a = faceCells[a0];
        const bm = faceMats[a0];
        const f = sign * faceSigns[a0] < 0 ? minusOne : F.one;
        // ±B⁻¹·b, kept as a scalar when both factors are scalar blocks.
        const tScalar = Binv.scalar !== undefined && bm.scalar !== undefined ? F.mul(f, F.mul(Binv.scalar, bm.scalar)) : undefined;
        const tb = tScalar === undefined ? mulMat(F, Binv, bm, f) : undefined;
        for (let j = 0; j < nc; j++) {
          const w = cofaceCells[j];
          const c = cofaceMats[j];
          const cur = overlay.find(a, w);
          if (tScalar !== undefined && c.scalar !== undefined && (cur === undefined || cur.scalar !== undefined)) {
            // Scalar blocks (constant and locally constant sheaves): no temporaries.
            let x = F.mul(c.scalar, tScalar);
            if (cofaceSigns[j] < 0) x = F.neg(x);
            if (cur) cur.scalar = F.sub(cur.scalar as E, x);
            else overlay.add(a, w, scalarMat(c.rows, F.neg(x)));
            continue;
          }
          const x = mulMat(F, c, tb ?? scalarMat(bm.cols, tScalar as E), cofaceSigns[j] < 0 ? minusOne : F.one);
          if (cur) subInPlace(F, cur, x);
          else overlay.add(a, w, copyMat(F, x, minusOne));
        }
      }
    }
    remove(s);
    remove(t);
  };

  for (let i = 0; i < m.eventCell.length; i++) {
    const p = m.eventPair[i];
    if (p < 0) {
      const g = m.eventCell[i];
      const d = degreeOf[g];
      if (d === k || d === k + 1) makeCritical(g);
      continue;
    }
    const pk = m.eventCell[i];
    if (pk === k) eliminate(p);
    else if (pk === k - 1) remove(offset[k] + m.pairTau[pk][p]);
    else if (pk === k + 1) remove(offset[k + 1] + m.pairSigma[pk][p]);
  }

  const out: MorseEntries<E> = { rows: [], cols: [], mats: [] };
  const cells: number[] = [];
  const mats: Mat<E>[] = [];
  for (let t = 0; t < X.dims[k + 1].length; t++) {
    const g = offset[k + 1] + t;
    if (m.state[g] !== CRITICAL) continue;
    const n = overlay.faces(g, cells, mats);
    for (let j = 0; j < n; j++) {
      if (isZeroMat(F, mats[j], m.scale[k])) continue;
      out.rows.push(g);
      out.cols.push(cells[j]);
      out.mats.push(mats[j]);
    }
  }
  return out;
}

function isEmptyCell(X: BasedComplex<unknown>, k: number, c: number): boolean {
  return X.dims[k][c] === 0;
}
