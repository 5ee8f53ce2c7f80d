import { parseIntToken } from './numberToken';

const SLASH = 47;

/** The vertex part of `v`, `v/vt`, `v/vt/vn` or `v//vn`; NaN when any part is malformed. */
export function vertexIndex(text: string, start: number, end: number): number {
  let slash = start;
  while (slash < end && text.charCodeAt(slash) !== SLASH) slash++;
  const index = parseIntToken(text, start, slash);
  if (slash === end || Number.isNaN(index)) return index;
  let parts = 1;
  let from = slash + 1;
  while (from <= end) {
    let to = from;
    while (to < end && text.charCodeAt(to) !== SLASH) to++;
    if (++parts > 3) return NaN;
    // The texture part may be empty (`v//vn`), the normal part may not.
    if (to > from ? Number.isNaN(parseIntToken(text, from, to)) : parts === 3 || to === end) return NaN;
    from = to + 1;
  }
  return index;
}
