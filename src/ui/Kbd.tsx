export function Kbd({ children }: { children: string }) {
  return <kbd className="num rounded border border-rule bg-sheet px-1 text-[11px] text-ink-soft">{children}</kbd>;
}
