import { useEffect } from 'react';

export type Hotkeys = Record<string, (e: KeyboardEvent) => void>;

/**
 * Desktop-style shortcuts: keys like "r", "mod+enter", "escape", "?".
 * Plain keys are ignored while typing in a field; "mod+" ones are not.
 */
export function useHotkeys(keys: Hotkeys, enabled = true): void {
  useEffect(() => {
    if (!enabled) return;
    const onKey = (e: KeyboardEvent) => {
      const target = e.target as HTMLElement | null;
      const typing = !!target && (target.tagName === 'INPUT' || target.tagName === 'TEXTAREA' || target.tagName === 'SELECT' || target.isContentEditable);
      const mod = e.ctrlKey || e.metaKey;
      const name = `${mod ? 'mod+' : ''}${e.shiftKey && e.key.length > 1 ? 'shift+' : ''}${e.key.toLowerCase()}`;
      const handler = keys[name];
      if (!handler || (typing && !mod && name !== 'escape')) return;
      e.preventDefault();
      handler(e);
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [keys, enabled]);
}
