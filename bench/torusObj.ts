/** A torus of N × N squares cut in two, as OBJ text with coordinates on the ring. */
export function torusObj(n: number): string {
  const out: string[] = [];
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      const u = (2 * Math.PI * i) / n;
      const w = (2 * Math.PI * j) / n;
      out.push(`v ${((3 + Math.cos(w)) * Math.cos(u)).toFixed(4)} ${((3 + Math.cos(w)) * Math.sin(u)).toFixed(4)} ${Math.sin(w).toFixed(4)}`);
    }
  const id = (i: number, j: number) => (i % n) * n + (j % n) + 1;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out.push(`f ${id(i, j)} ${id(i + 1, j)} ${id(i + 1, j + 1)}`, `f ${id(i, j)} ${id(i + 1, j + 1)} ${id(i, j + 1)}`);
  return out.join('\n') + '\n';
}
