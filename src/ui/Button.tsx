import type { ButtonHTMLAttributes } from 'react';

type Tone = 'plain' | 'primary' | 'danger' | 'quiet';

const tones: Record<Tone, string> = {
  plain: 'border-rule bg-sheet hover:bg-rule-soft text-ink',
  primary: 'border-glued bg-glued text-white hover:brightness-110',
  danger: 'border-odds bg-sheet text-odds hover:bg-odds-soft',
  quiet: 'border-transparent bg-transparent text-ink-soft hover:text-ink hover:bg-rule-soft',
};

export function Button({ tone = 'plain', className = '', ...rest }: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: Tone }) {
  return (
    <button
      type="button"
      className={`inline-flex items-center gap-1 rounded border px-2.5 py-1 text-sm disabled:cursor-not-allowed disabled:opacity-50 ${tones[tone]} ${className}`}
      {...rest}
    />
  );
}
