/**
 * Positions for a graph with no coordinates of its own: the two smoothest
 * non-constant eigenvectors of the lazy random walk (a spectral layout,
 * found by power iteration with Gram–Schmidt against the constant vector).
 * Each connected component is laid out on its own and the components are
 * placed on a grid, so a disconnected model stays readable. Linear work per
 * iteration, so 10^5-edge models lay out in a fraction of a second.
 */
export function spectralLayout(n: number, edges: Int32Array, iterations?: number): Float32Array {
  const out = new Float32Array(2 * n);
  if (n === 0) return out;
  const degree = new Int32Array(n);
  for (let e = 0; e < edges.length; e += 2) {
    degree[edges[e]]++;
    degree[edges[e + 1]]++;
  }
  const ptr = new Int32Array(n + 1);
  for (let v = 0; v < n; v++) ptr[v + 1] = ptr[v] + degree[v];
  const adj = new Int32Array(ptr[n]);
  const fill = ptr.slice(0, n);
  for (let e = 0; e < edges.length; e += 2) {
    adj[fill[edges[e]]++] = edges[e + 1];
    adj[fill[edges[e + 1]]++] = edges[e];
  }
  const comp = new Int32Array(n).fill(-1);
  const members: number[][] = [];
  const stack: number[] = [];
  for (let s = 0; s < n; s++) {
    if (comp[s] >= 0) continue;
    const id = members.length;
    const list: number[] = [];
    comp[s] = id;
    stack.push(s);
    while (stack.length) {
      const v = stack.pop() as number;
      list.push(v);
      for (let p = ptr[v]; p < ptr[v + 1]; p++) {
        const w = adj[p];
        if (comp[w] < 0) {
          comp[w] = id;
          stack.push(w);
        }
      }
    }
    members.push(list);
  }
  const big = members.map((m, i) => [m.length, i]).sort((a, b) => b[0] - a[0]);
  const cols = Math.ceil(Math.sqrt(members.length));
  big.forEach(([, ci], slot) => {
    const list = members[ci];
    const xy = layoutComponent(list, ptr, adj, iterations);
    const cx = slot % cols;
    const cy = Math.floor(slot / cols);
    const size = 1 / cols;
    for (let i = 0; i < list.length; i++) {
      out[2 * list[i]] = (cx + 0.1 + 0.8 * xy[2 * i]) * size;
      out[2 * list[i] + 1] = (cy + 0.1 + 0.8 * xy[2 * i + 1]) * size;
    }
  });
  return out;
}

function layoutComponent(list: number[], ptr: Int32Array, adj: Int32Array, iterations?: number): Float32Array {
  const m = list.length;
  const xy = new Float32Array(2 * m);
  if (m === 1) {
    xy[0] = xy[1] = 0.5;
    return xy;
  }
  const local = new Map<number, number>();
  list.forEach((v, i) => local.set(v, i));
  let edgesHere = 0;
  for (const v of list) edgesHere += ptr[v + 1] - ptr[v];
  const steps = iterations ?? Math.max(40, Math.min(400, Math.round(3e7 / Math.max(1, edgesHere))));
  // Deterministic start, so the same model always gets the same picture.
  let seed = 7;
  const rand = () => ((seed = (Math.imul(seed, 1103515245) + 12345) >>> 0) / 2 ** 32) - 0.5;
  const a = new Float64Array(m).map(rand);
  const b = new Float64Array(m).map(rand);
  const na = new Float64Array(m);
  const nb = new Float64Array(m);
  const nbr = list.map((v) => {
    const out: number[] = [];
    for (let p = ptr[v]; p < ptr[v + 1]; p++) out.push(local.get(adj[p]) as number);
    return Int32Array.from(out);
  });
  for (let it = 0; it < steps; it++) {
    for (let i = 0; i < m; i++) {
      const ns = nbr[i];
      let sa = 0;
      let sb = 0;
      for (let j = 0; j < ns.length; j++) {
        sa += a[ns[j]];
        sb += b[ns[j]];
      }
      const d = ns.length || 1;
      na[i] = 0.5 * (a[i] + sa / d);
      nb[i] = 0.5 * (b[i] + sb / d);
    }
    orthonormalise(na, nb);
    a.set(na);
    b.set(nb);
  }
  let minA = Infinity;
  let maxA = -Infinity;
  let minB = Infinity;
  let maxB = -Infinity;
  for (let i = 0; i < m; i++) {
    minA = Math.min(minA, a[i]);
    maxA = Math.max(maxA, a[i]);
    minB = Math.min(minB, b[i]);
    maxB = Math.max(maxB, b[i]);
  }
  const span = Math.max(maxA - minA, maxB - minB) || 1;
  for (let i = 0; i < m; i++) {
    xy[2 * i] = (a[i] - minA) / span + (1 - (maxA - minA) / span) / 2;
    xy[2 * i + 1] = (b[i] - minB) / span + (1 - (maxB - minB) / span) / 2;
  }
  return xy;
}

function orthonormalise(a: Float64Array, b: Float64Array): void {
  const m = a.length;
  const centre = (v: Float64Array) => {
    let s = 0;
    for (let i = 0; i < m; i++) s += v[i];
    s /= m;
    for (let i = 0; i < m; i++) v[i] -= s;
  };
  const normalise = (v: Float64Array) => {
    let s = 0;
    for (let i = 0; i < m; i++) s += v[i] * v[i];
    s = Math.sqrt(s) || 1;
    for (let i = 0; i < m; i++) v[i] /= s;
  };
  centre(a);
  normalise(a);
  centre(b);
  let dot = 0;
  for (let i = 0; i < m; i++) dot += a[i] * b[i];
  for (let i = 0; i < m; i++) b[i] -= dot * a[i];
  normalise(b);
}
