import { useMemo, useState } from 'react';
import type { CellRef, ReadingsCheck } from '../compute/readingsService';
import { download, stem } from '../kits/download';
import { Button } from '../ui/Button';
import { Cautions } from '../ui/Cautions';
import { checkCsv, checkJson, cellName, cellText } from './readingsExport';
import { formatSize } from './Sketch';

/** Rows shown in the table; the export has all of them. */
const SHOWN_ROWS = 200;

type Table = 'pairs' | 'residuals';
type Sort = { key: string; descending: boolean };

interface Row {
  key: string;
  cells: CellRef[];
  columns: Record<string, string | number>;
}

/** What a readings check found: figures, the worst pairs and residuals (pick one to see it on the Sketch), export, cautions. */
export function ReadingsFindings({ check, modelName, picked, onPick }: { check: ReadingsCheck; modelName: string; picked?: string; onPick(key: string | undefined, cells: CellRef[]): void }) {
  const [table, setTable] = useState<Table>('pairs');
  const [sort, setSort] = useState<Sort>({ key: 'size', descending: true });
  const consistent = check.radius.max <= 1e-9 * Math.max(1, ...check.cells.map((c) => Math.hypot(...c.reading)));
  const s = check.spectrum;

  const rows = useMemo((): Row[] => {
    const list: Row[] =
      table === 'pairs'
        ? check.worst.map((p, i) => ({ key: `pair-${i}`, cells: [p.face, p.coface], columns: { face: cellName(p.face), coface: cellName(p.coface), size: p.mismatch } }))
        : check.cells.map((c, i) => ({ key: `cell-${i}`, cells: [c.cell], columns: { cell: cellName(c.cell), weight: c.weight, size: c.norm } }));
    const dir = sort.descending ? -1 : 1;
    return list.slice().sort((a, b) => {
      const x = a.columns[sort.key];
      const y = b.columns[sort.key];
      return (typeof x === 'number' && typeof y === 'number' ? x - y : String(x).localeCompare(String(y), 'en', { numeric: true })) * dir;
    });
  }, [check, table, sort]);
  const columns: [string, string][] = table === 'pairs' ? [['face', 'face'], ['coface', 'coface'], ['size', 'mismatch']] : [['cell', 'cell'], ['weight', 'weight'], ['size', 'residual ‖r‖']];

  return (
    <section aria-label="Readings check" className="space-y-3 text-sm" data-testid="readings-findings">
      <p className={`rounded px-2 py-1.5 ${consistent ? 'bg-glued-soft' : 'bg-odds-soft'}`} data-testid="readings-headline">
        {check.radius.pairs === 0
          ? 'No face pair has readings on both cells, so the readings cannot disagree with each other; see the residuals against the nearest global section.'
          : consistent
            ? 'The readings agree on every assigned face pair: they glue.'
            : `The readings disagree: the worst pair is ${cellName(check.worst[0].face)} against ${cellName(check.worst[0].coface)}, off by ${formatSize(check.worst[0].mismatch)}.`}
      </p>
      <dl className="grid grid-cols-[11rem_1fr] gap-y-0.5 text-xs">
        <dt className="text-ink-faint">consistency radius (max)</dt>
        <dd className="num font-semibold" data-testid="readings-radius-max">{formatSize(check.radius.max)}</dd>
        <dt className="text-ink-faint">consistency radius (RMS)</dt>
        <dd className="num" data-testid="readings-radius-rms">{formatSize(check.radius.rms)}</dd>
        <dt className="text-ink-faint">assigned face pairs</dt>
        <dd className="num" data-testid="readings-pairs">{check.radius.pairs.toLocaleString('en')}</dd>
        <dt className="text-ink-faint">nearest global section</dt>
        <dd className="num" data-testid="readings-section">
          dim H⁰ {check.section.dimH0} · weighted RMS residual {formatSize(check.section.weightedRms)}
          {!check.section.determined && <span className="text-odds"> · not pinned down by these readings (one of many equally good fits)</span>}
        </dd>
        <dt className="text-ink-faint">smallest eigenvalues of L⁰</dt>
        <dd className="num" data-testid="readings-spectrum">
          {'skipped' in s ? s.skipped : `${s.values.map((x) => (Math.abs(x) <= 1e-9 * (s.scale || 1) ? '≈ 0' : formatSize(x))).join(', ')}${s.converged ? '' : ' (not converged)'}`}
        </dd>
        <dt className="text-ink-faint">provenance</dt>
        <dd className="num truncate" title={check.modelHash}>
          {check.readingsName} · {check.count.toLocaleString('en')} readings · model v{check.modelVersion} ({check.field}, checked in floating point) · engine {check.engineVersion} · {Math.round(check.ms)} ms
        </dd>
      </dl>
      {!('skipped' in s) && (
        <p className="text-[11px] text-ink-faint">
          L⁰ has {s.harmonicDimension} zero eigenvalue{s.harmonicDimension === 1 ? '' : 's'} (the free directions of a global section); a small positive smallest eigenvalue means the maps themselves almost, but do not quite, close up.
        </p>
      )}
      <div className="flex gap-1" role="tablist" aria-label="Readings tables">
        {(
          [
            ['pairs', `Worst pairs (${check.worst.length})`],
            ['residuals', `Residuals (${check.cells.length})`],
          ] as const
        ).map(([id, label]) => (
          <button key={id} role="tab" aria-selected={table === id} onClick={() => {
              setTable(id);
              // Each table opens with its largest first: that is what a reader looks for.
              setSort({ key: 'size', descending: true });
            }} className={`rounded px-2 py-0.5 text-xs ${table === id ? 'bg-ink text-paper' : 'hover:bg-rule-soft'}`}>
            {label}
          </button>
        ))}
      </div>
      <div className="max-h-72 overflow-auto rounded border border-rule">
        <table className="num w-full text-xs" data-testid={table === 'pairs' ? 'worst-pairs' : 'residuals'}>
          <thead className="sticky top-0 bg-sheet text-ink-faint">
            <tr>
              {columns.map(([key, label]) => (
                <th key={key} className={`font-normal ${key === 'size' || key === 'weight' ? 'text-right' : 'text-left'}`} aria-sort={sort.key === key ? (sort.descending ? 'descending' : 'ascending') : 'none'}>
                  <button className="px-1 hover:text-ink" onClick={() => setSort((o) => ({ key, descending: o.key === key ? !o.descending : key === 'size' }))}>
                    {label} {sort.key === key ? (sort.descending ? '↓' : '↑') : ''}
                  </button>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.slice(0, SHOWN_ROWS).map((row) => (
              <tr
                key={row.key}
                aria-selected={picked === row.key}
                tabIndex={0}
                data-testid="readings-row"
                data-cells={row.cells.map(cellText).join(' ')}
                onClick={() => onPick(picked === row.key ? undefined : row.key, row.cells)}
                onKeyDown={(e) => e.key === 'Enter' && onPick(picked === row.key ? undefined : row.key, row.cells)}
                className={`cursor-pointer ${picked === row.key ? 'bg-ink text-paper' : 'hover:bg-rule-soft'}`}
              >
                {columns.map(([key]) => (
                  <td key={key} className={`px-1 ${key === 'size' || key === 'weight' ? 'text-right' : ''}`}>
                    {typeof row.columns[key] === 'number' ? formatSize(row.columns[key] as number) : row.columns[key]}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {rows.length > SHOWN_ROWS && <p className="text-[11px] text-ink-faint">The first {SHOWN_ROWS} of {rows.length.toLocaleString('en')} rows in this order; the export has them all.</p>}
      <p className="text-[11px] text-ink-faint">Pick a row to point out its cells on the Sketch; the Sketch colours each cell with a reading by its residual.</p>
      <div className="no-print flex gap-2">
        <Button onClick={() => download(`${stem(modelName)}-${stem(check.readingsName)}-check.json`, checkJson(check, modelName), 'application/json')} data-testid="readings-export-json">
          Export JSON
        </Button>
        <Button onClick={() => download(`${stem(modelName)}-${stem(check.readingsName)}-check.csv`, checkCsv(check), 'text/csv')} data-testid="readings-export-csv">
          Export CSV
        </Button>
      </div>
      <ReadingsCaution />
    </section>
  );
}

/** What a readings check is not, said where the numbers are. */
export function ReadingsCaution() {
  return (
    <div className="space-y-2">
      <p className="rounded border border-rule bg-sheet p-2 text-[11px] text-ink-soft" data-testid="readings-caution">
        A readings check measures how far field readings disagree with each other and with the model, in floating point, with the weights given. It does not say which
        instrument is right, nor whether a structure, a site or a network is safe. Readings feed decisions that can hurt people: a large residual is a reason to go
        back and measure again, and any decision about safety belongs to licensed engineers and surveyors under local regulations.
      </p>
      <Cautions compact />
    </div>
  );
}
