import { ProblemList, type Problem } from '../../engine/model/Problem';
import { parseDecimalCell, readCsvTable } from '../csv/readCsvTable';
import { AXES, type Bar, type Frame, type Joint } from './Frame';

export type ReadFrameResult = { frame: Frame; problems: [] } | { frame: undefined; problems: Problem[] };

/** Joints closer than this fraction of the frame's size count as coincident. */
const COINCIDENT = 1e-9;

/**
 * Read a pin-jointed frame from `joints.csv` (`id,x,y` in the plane or
 * `id,x,y,z` in space, and an optional `fixed` column naming the axes a
 * support holds: `x`, `y`, `xy`, `xyz`, …; empty = free) and `bars.csv`
 * (`id,from,to`). Rejects coincident joints, bars to missing joints,
 * zero-length bars and two bars on the same pair of joints; never throws
 * on bad input.
 */
export function readFrameCsv(jointsText: string, barsText: string, files = { joints: 'joints.csv', bars: 'bars.csv' }): ReadFrameResult {
  const problems = new ProblemList();
  const fail = (): ReadFrameResult => ({ frame: undefined, problems: problems.items });
  const jt = readCsvTable(jointsText, files.joints, ['id', 'x', 'y'], problems);
  const bt = readCsvTable(barsText, files.bars, ['id', 'from', 'to'], problems);
  if (!jt || !bt) return fail();
  const dimension = jt.columns.includes('z') ? 3 : 2;
  const axes = AXES.slice(0, dimension);
  const joints: Joint[] = [];
  const byId = new Map<string, Joint>();
  for (const row of jt.rows) {
    const at = `${jt.file} line ${row.line}`;
    const id = row.cells.id;
    if (id === '') {
      problems.add(at, 'the joint id is empty');
      continue;
    }
    if (byId.has(id)) {
      problems.add(at, `joint "${id}" is listed twice (first on line ${byId.get(id)!.line})`);
      continue;
    }
    const position: number[] = [];
    for (const a of axes) {
      const x = parseDecimalCell(row.cells[a]);
      if (typeof x === 'string') problems.add(at, `${a} of joint "${id}" ${x}`);
      else position.push(x);
    }
    const fixedText = (row.cells.fixed ?? '').toLowerCase().replace(/[\s,+]/g, '');
    const fixed = axes.map(() => false);
    let ok = position.length === dimension;
    for (const ch of fixedText) {
      const a = axes.indexOf(ch as (typeof axes)[number]);
      if (a < 0) {
        problems.add(at, `fixed "${row.cells.fixed}" of joint "${id}": "${ch}" is not an axis of a ${dimension === 2 ? 'plane (x, y)' : 'space (x, y, z)'} frame`);
        ok = false;
        break;
      }
      fixed[a] = true;
    }
    if (!ok) continue;
    const joint = { id, position, fixed, line: row.line };
    joints.push(joint);
    byId.set(id, joint);
  }
  if (joints.length === 0 && !problems.any) problems.add(jt.file, 'lists no joints');
  if (problems.any) return fail();
  checkCoincident(joints, jt.file, problems);
  const bars: Bar[] = [];
  const barIds = new Map<string, number>();
  const pairs = new Map<string, Bar>();
  for (const row of bt.rows) {
    const at = `${bt.file} line ${row.line}`;
    const { id, from, to } = row.cells;
    if (id === '') {
      problems.add(at, 'the bar id is empty');
      continue;
    }
    if (barIds.has(id)) {
      problems.add(at, `bar "${id}" is listed twice (first on line ${barIds.get(id)})`);
      continue;
    }
    barIds.set(id, row.line);
    let ok = true;
    for (const [end, j] of [['from', from], ['to', to]] as const) {
      if (j === '') {
        problems.add(at, `bar "${id}": "${end}" is empty`);
        ok = false;
      } else if (!byId.has(j)) {
        problems.add(at, `bar "${id}" ends at a missing joint "${j}" (not in ${jt.file})`);
        ok = false;
      }
    }
    if (!ok) continue;
    if (from === to) {
      problems.add(at, `bar "${id}" has zero length (both ends at joint "${from}")`);
      continue;
    }
    const key = [from, to].sort().join('\u0000');
    const twin = pairs.get(key);
    if (twin) {
      problems.add(at, `bars "${twin.id}" and "${id}" both join "${from}" and "${to}"; give one bar per pair of joints`);
      continue;
    }
    const bar = { id, from, to, line: row.line };
    pairs.set(key, bar);
    bars.push(bar);
  }
  if (problems.any) return fail();
  return { frame: { dimension, joints, bars }, problems: [] };
}

/** Coincident joints make bar directions meaningless; found by a sweep along x. */
function checkCoincident(joints: Joint[], file: string, problems: ProblemList): void {
  const d = joints[0].position.length;
  let size = 0;
  for (let a = 0; a < d; a++) {
    let lo = Infinity;
    let hi = -Infinity;
    for (const j of joints) {
      lo = Math.min(lo, j.position[a]);
      hi = Math.max(hi, j.position[a]);
    }
    size = Math.max(size, hi - lo);
  }
  const tol = COINCIDENT * size;
  const order = joints.map((_, i) => i).sort((i, j) => joints[i].position[0] - joints[j].position[0]);
  for (let s = 0; s < order.length && !problems.full; s++) {
    const p = joints[order[s]];
    for (let t = s + 1; t < order.length; t++) {
      const q = joints[order[t]];
      if (q.position[0] - p.position[0] > tol) break;
      let dist = 0;
      for (let a = 0; a < d; a++) dist = Math.max(dist, Math.abs(q.position[a] - p.position[a]));
      if (dist <= tol) {
        const [first, second] = p.line < q.line ? [p, q] : [q, p];
        problems.add(`${file} line ${second.line}`, `joints "${first.id}" and "${second.id}" coincide at (${second.position.join(', ')})`);
      }
    }
  }
}
