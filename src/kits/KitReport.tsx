import type { ReactNode } from 'react';
import { Button } from '../ui/Button';
import { Cautions } from '../ui/Cautions';
import { SaveToProject, type KitSave } from './SaveToProject';

/**
 * The frame every kit result sits in: a report heading with the inputs and
 * settings used, export and print buttons (hidden on paper), the result,
 * and the cautions on screen and in print.
 */
export function KitReport(props: {
  title: string;
  inputs: string[];
  settings: [string, string][];
  kitCaution: string;
  onJson(): void;
  onCsv(): void;
  /** Offer to keep the input and result in a project. */
  save?: KitSave;
  children: ReactNode;
}) {
  return (
    <section aria-label="Kit report" className="kit-report space-y-4">
      <header className="flex flex-wrap items-start gap-4 border-b border-rule pb-2">
        <div className="min-w-0 flex-1">
          <p className="hidden text-xs text-ink-soft print:block">Gluefield kit report · printed {new Date().toLocaleString()}</p>
          <h2 className="text-base font-semibold">{props.title}</h2>
          <p className="num text-xs text-ink-soft">{props.inputs.join(' · ')}</p>
          <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-xs" data-testid="kit-settings">
            {props.settings.map(([k, v]) => (
              <div key={k} className="contents">
                <dt className="text-ink-soft">{k}</dt>
                <dd>{v}</dd>
              </div>
            ))}
          </dl>
        </div>
        <div className="no-print flex gap-2">
          <Button onClick={props.onJson} data-testid="export-json">
            Export JSON
          </Button>
          <Button onClick={props.onCsv} data-testid="export-csv">
            Export CSV
          </Button>
          <Button onClick={() => window.print()} data-testid="print-report">
            Print report
          </Button>
        </div>
      </header>
      {props.save && (
        <div className="no-print">
          <SaveToProject save={props.save} />
        </div>
      )}
      {props.children}
      <p className="rounded border border-rule bg-sheet p-2 text-xs text-ink-soft" data-testid="kit-caution">
        {props.kitCaution}
      </p>
      <Cautions compact />
    </section>
  );
}

/** A small labelled figure (Gluefield's number cards). */
export function Figure({ label, value, testId, tone }: { label: string; value: string; testId?: string; tone?: 'glued' | 'odds' }) {
  return (
    <div className="rounded border border-rule bg-sheet px-3 py-1.5">
      <div className="text-[11px] text-ink-soft">{label}</div>
      <div data-testid={testId} className={`num text-base ${tone === 'odds' ? 'text-odds' : tone === 'glued' ? 'text-glued' : ''}`}>
        {value}
      </div>
    </div>
  );
}
