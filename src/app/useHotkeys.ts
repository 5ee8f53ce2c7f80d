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
      // Shift is named for named keys and letters (mod+shift+z), not for the symbols it makes ("?" is shift+/).
      const shift = e.shiftKey && (e.key.length > 1 || e.key.toLowerCase() !== e.key.toUpperCase());
      const name = `${mod ? 'mod+' : ''}${shift ? 'shift+' : ''}${e.key.toLowerCase()}`;
      const handler = keys[name];
      if (!handler || (typing && !mod && name !== 'escape')) return;
      e.preventDefault();
      handler(e);
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [keys, enabled]);
}
