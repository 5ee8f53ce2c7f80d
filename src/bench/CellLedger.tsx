import { useQueries } from '@tanstack/react-query';
import { useVirtualizer } from '@tanstack/react-virtual';
import { useMemo, useRef, useState } from 'react';
import { engine } from '../workers/engineClient';

const PAGE = 500;
const ROW = 26;

export interface LedgerValues {
  /** degree the values belong to */
  degree: number;
  /** flat stalk coordinates in cell order, with the offset of each cell */
  values: Float64Array;
  offsets: Int32Array;
  label: string;
}

/**
 * Every cell of the model, one degree at a time, in a virtualised table:
 * only the visible rows exist in the page and cells arrive from the worker
 * a page at a time, so a million rows scroll smoothly.
 */
export function CellLedger(props: { modelId: string; version: number; cells: number[]; critical?: Int32Array[]; values?: LedgerValues }) {
  const [k, setK] = useState(0);
  const total = props.cells[k] ?? 0;
  const parent = useRef<HTMLDivElement>(null);
  const rows = useVirtualizer({ count: total, getScrollElement: () => parent.current, estimateSize: () => ROW, overscan: 20 });
  const items = rows.getVirtualItems();
  const pages = useMemo(() => {
    const set = new Set<number>();
    for (const it of items) set.add(Math.floor(it.index / PAGE));
    return [...set];
  }, [items]);
  const fetched = useQueries({
    queries: pages.map((p) => ({
      queryKey: ['cells', props.modelId, props.version, k, p],
      queryFn: () => engine().cells(props.modelId, k, p * PAGE, PAGE),
      staleTime: Infinity,
    })),
  });
  const byPage = new Map(pages.map((p, i) => [p, fetched[i].data]));
  const critical = useMemo(() => new Set(props.critical?.[k] ?? []), [props.critical, k]);
  const values = props.values?.degree === k ? props.values : undefined;

  return (
    <div className="flex h-full flex-col">
      <div className="flex items-center gap-2 border-b border-rule px-3 py-2 text-sm">
        <span className="text-ink-soft">Dimension</span>
        {props.cells.map((n, d) => (
          <button
            key={d}
            onClick={() => setK(d)}
            aria-pressed={d === k}
            className={`rounded px-2 py-0.5 ${d === k ? 'bg-ink text-paper' : 'hover:bg-rule-soft'}`}
          >
            {d} <span className="num text-[11px] opacity-70">({n.toLocaleString()})</span>
          </button>
        ))}
        {values && <span className="ml-auto text-xs text-ink-soft">values: {values.label}</span>}
      </div>
      <div className="num grid grid-cols-[6rem_1fr_4rem_5rem_8rem] border-b border-rule bg-sheet px-3 py-1 text-[11px] text-ink-faint uppercase">
        <span>#</span>
        <span>vertices</span>
        <span>stalk</span>
        <span>critical</span>
        <span>value</span>
      </div>
      <div ref={parent} data-testid="cell-ledger" className="min-h-0 flex-1 overflow-auto" role="table" aria-rowcount={total}>
        {total === 0 && <p className="p-4 text-sm text-ink-soft">No cells of dimension {k}.</p>}
        <div style={{ height: rows.getTotalSize(), position: 'relative' }}>
          {items.map((it) => {
            const page = byPage.get(Math.floor(it.index / PAGE));
            const cell = page?.[it.index % PAGE];
            return (
              <div
                key={it.key}
                role="row"
                className="num absolute grid w-full grid-cols-[6rem_1fr_4rem_5rem_8rem] px-3 text-xs leading-[26px] odd:bg-paper/50"
                style={{ top: it.start, height: ROW }}
              >
                <span className="text-ink-faint">{it.index}</span>
                <span>{cell ? `[${cell.vertices.join(', ')}]` : '…'}</span>
                <span>{cell?.stalk ?? ''}</span>
                <span>{critical.has(it.index) ? '●' : ''}</span>
                <span>{values && cell ? formatValues(values, it.index) : ''}</span>
              </div>
            );
          })}
        </div>
      </div>
    </div>
  );
}

function formatValues(v: LedgerValues, cell: number): string {
  const out: string[] = [];
  for (let i = v.offsets[cell]; i < v.offsets[cell + 1]; i++) out.push(fmt(v.values[i]));
  return out.join(', ');
}

export function fmt(x: number): string {
  if (x === 0) return '0';
  if (Number.isInteger(x) && Math.abs(x) < 1e9) return String(x);
  return Math.abs(x) >= 1e-3 && Math.abs(x) < 1e6 ? x.toFixed(4).replace(/\.?0+$/, '') : x.toExponential(3);
}
