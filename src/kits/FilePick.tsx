import { useRef, useState } from 'react';
import type { NamedText } from './demoFiles';

/** A labelled file picker that also takes a dropped file; shows the chosen file's name. */
export function FilePick(props: { label: string; accept: string; testId: string; file: NamedText | undefined; onFile(file: File): void }) {
  const input = useRef<HTMLInputElement>(null);
  const [over, setOver] = useState(false);
  return (
    <div
      data-testid={`${props.testId}-drop`}
      className={`flex min-w-56 flex-1 flex-col gap-1 rounded border border-dashed p-3 text-sm ${over ? 'border-glued bg-glued-soft' : 'border-rule bg-sheet'}`}
      onDragOver={(e) => {
        e.preventDefault();
        setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={(e) => {
        e.preventDefault();
        setOver(false);
        const f = e.dataTransfer.files[0];
        if (f) props.onFile(f);
      }}
    >
      <span className="font-medium">{props.label}</span>
      <span className="num truncate text-xs text-ink-soft">{props.file ? props.file.name : 'drop a file here, or'}</span>
      <label className="w-fit cursor-pointer rounded border border-rule px-2 py-0.5 text-xs hover:bg-rule-soft">
        choose file…
        <input
          ref={input}
          data-testid={props.testId}
          type="file"
          accept={props.accept}
          className="sr-only"
          onChange={(e) => {
            const f = e.target.files?.[0];
            if (f) props.onFile(f);
            e.target.value = '';
          }}
        />
      </label>
    </div>
  );
}

/** Read a picked file as text with its name. */
export async function readPicked(file: File): Promise<NamedText> {
  return { name: file.name, text: await file.text() };
}
