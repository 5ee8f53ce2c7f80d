import { ProblemList } from '../engine/model/Problem';
import type { ImportOptions, ImportResult } from './ImportResult';
import { LineTokens } from './LineTokens';
import { MeshBuilder } from './MeshBuilder';
import { meshImport, progressStep, type MeshReadOptions, type MeshReadResult } from './MeshData';
import { parseFloatToken } from './numberToken';
import { vertexIndex } from './objVertexIndex';
import { scanObj } from './scanObj';
import { Int32List } from './TypedList';

const V = 118;
const F = 102;
const L = 108;

/**
 * Read a Wavefront OBJ mesh (the geometry subset: `v`, `f`, `l`) as the
 * constant sheaf on its triangulated surface. OBJ vertex numbers start at
 * 1 and negative ones count back from the last vertex read; model vertex
 * ids are the 0-based positions. Face corners may be `v`, `v/vt`, `v/vt/vn`
 * or `v//vn`; polygons are fan-triangulated; `l` polylines become edges.
 * Vertices used by nothing stay as isolated points. Other statements
 * (`vt`, `vn`, `o`, `g`, `s`, `usemtl`, `mtllib`, …) are ignored.
 *
 * Never throws on bad input: problems come back located by line.
 */
export function importObj(text: string, options: ImportOptions = {}): ImportResult {
  return meshImport(readObj(text), options);
}

/** As {@link importObj}, giving the mesh in typed arrays (see {@link MeshData}) instead of a model file. */
export function readObj(text: string, options: MeshReadOptions = {}): MeshReadResult {
  const mesh = scanObj(text, options.progress);
  return mesh ? { mesh } : readObjByLines(text, options);
}

/** The line-by-line reader behind {@link readObj}: slower, and it names the line of every problem. */
export function readObjByLines(text: string, options: MeshReadOptions = {}): MeshReadResult {
  const reader = new ObjReader(text, options.progress);
  reader.read();
  if (reader.problems.any) return { problems: reader.problems.items };
  return { mesh: reader.mesh.toData() };
}

class ObjReader {
  readonly problems = new ProblemList();
  readonly mesh = new MeshBuilder();
  private readonly tokens: LineTokens;
  private corners = new Int32Array(16);
  private readonly xyz = new Float64Array(3);
  /** (line, index) of positive indices past the vertices read so far, checked at the end. */
  private readonly ahead = new Int32List(16);

  constructor(
    private readonly text: string,
    private readonly progress?: (fraction: number) => void,
  ) {
    this.tokens = new LineTokens(text);
  }

  read(): void {
    const { tokens, text, problems } = this;
    const progress = this.progress;
    const step = progressStep(text.length);
    let mark = step;
    let statements = 0;
    while (!problems.full && tokens.nextLine()) {
      if (progress && tokens.offset >= mark) {
        progress(Math.min(1, tokens.offset / text.length));
        mark = tokens.offset + step;
      }
      if (!tokens.next()) continue;
      statements++;
      if (tokens.end - tokens.start !== 1) continue;
      const keyword = text.charCodeAt(tokens.start);
      if (keyword === V) this.vertex();
      else if (keyword === F) this.face();
      else if (keyword === L) this.polyline();
    }
    const count = this.mesh.vertexCount;
    const ahead = this.ahead.data;
    let late = false;
    for (let i = 0; i < this.ahead.length; i += 2) {
      if (ahead[i + 1] > count) {
        problems.add(`line ${ahead[i]}`, outOfRange(ahead[i + 1], count));
        late = true;
      }
    }
    if (late) problems.items.sort((a, b) => lineOf(a.where) - lineOf(b.where));
    if (statements === 0) problems.add('line 1', 'the file is empty');
    else if (count === 0 && !problems.any) problems.add('line 1', 'the file has no vertices ("v" lines)');
  }

  private where(): string {
    return `line ${this.tokens.line}`;
  }

  private vertex(): void {
    const { tokens, text, xyz } = this;
    xyz.fill(NaN);
    for (let i = 0; i < 3; i++) {
      if (!tokens.next()) {
        this.problems.add(this.where(), 'a vertex needs three coordinates "v x y z"');
        break;
      }
      const value = parseFloatToken(text, tokens.start, tokens.end);
      if (Number.isNaN(value)) {
        this.problems.add(this.where(), `"${tokens.token()}" is not a number`);
        break;
      }
      xyz[i] = value;
    }
    // Added even when malformed, so that later indices keep their meaning.
    this.mesh.addVertex(xyz[0], xyz[1], xyz[2]);
  }

  private face(): void {
    const n = this.references();
    if (n < 0) return;
    if (n < 3) {
      this.problems.add(this.where(), `a face needs at least 3 vertices, got ${n}`);
      return;
    }
    const repeated = this.mesh.addPolygon(this.corners, n);
    if (repeated >= 0) this.problems.add(this.where(), `degenerate face: vertex ${repeated + 1} appears twice`);
  }

  private polyline(): void {
    const n = this.references();
    if (n < 0) return;
    if (n < 2) {
      this.problems.add(this.where(), `a line needs at least 2 vertices, got ${n}`);
      return;
    }
    const c = this.corners;
    for (let i = 1; i < n; i++) {
      if (c[i] === c[i - 1]) {
        this.problems.add(this.where(), `degenerate line: vertex ${c[i] + 1} follows itself`);
        return;
      }
    }
    for (let i = 1; i < n; i++) this.mesh.addEdge(c[i - 1], c[i]);
  }

  /** Read the rest of the line as vertex references into `corners`; their number, or -1 after a problem. */
  private references(): number {
    const { tokens, text } = this;
    const count = this.mesh.vertexCount;
    let n = 0;
    while (tokens.next()) {
      const index = vertexIndex(text, tokens.start, tokens.end);
      let id: number;
      if (Number.isNaN(index)) {
        this.problems.add(this.where(), `"${tokens.token()}" is not a vertex reference`);
        return -1;
      } else if (index === 0) {
        this.problems.add(this.where(), 'vertex index 0 is out of range: OBJ counts vertices from 1');
        return -1;
      } else if (index < 0) {
        id = count + index;
        if (id < 0) {
          this.problems.add(this.where(), `vertex index ${index} is out of range: only ${count} vertices precede it`);
          return -1;
        }
      } else {
        id = index - 1;
        if (index > 0x7fffffff) {
          this.problems.add(this.where(), outOfRange(index, count));
          return -1;
        }
        if (index > count) {
          // A vertex may follow the face that uses it; judged once all are read.
          this.ahead.push(tokens.line);
          this.ahead.push(index);
        }
      }
      if (n === this.corners.length) {
        const grown = new Int32Array(2 * n);
        grown.set(this.corners);
        this.corners = grown;
      }
      this.corners[n++] = id;
    }
    return n;
  }
}

function lineOf(where: string): number {
  return Number(/\d+/.exec(where)?.[0] ?? 0);
}

function outOfRange(index: number, count: number): string {
  return `vertex index ${index} is out of range: the file has ${count} vertices`;
}
