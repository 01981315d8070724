import type { KeyboardEvent } from 'react';

/**
 * The keys of a combobox's list box, one way for every list: arrows move, Home and End jump (while open),
 * Enter picks the active item, Escape closes (or, when closed, hands the key to `onEscapeClosed`).
 */
export function listboxKeyDown<T>({
  items,
  open,
  active,
  setOpen,
  setActive,
  onPick,
  onClose = () => setOpen(false),
  onEscapeClosed,
}: {
  items: T[];
  open: boolean;
  active: number;
  setOpen: (open: boolean) => void;
  setActive: (update: (a: number) => number) => void;
  onPick: (item: T) => void;
  onClose?: () => void;
  /** Escape on a closed list: return true when it did something */
  onEscapeClosed?: () => boolean;
}) {
  return (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === 'ArrowDown') {
      e.preventDefault();
      if (!open) setOpen(true);
      else setActive((a) => Math.min(a + 1, items.length - 1));
    } else if (e.key === 'ArrowUp') {
      e.preventDefault();
      setActive((a) => Math.max(a - 1, 0));
    } else if (e.key === 'Home' && open) {
      e.preventDefault();
      setActive(() => 0);
    } else if (e.key === 'End' && open) {
      e.preventDefault();
      setActive(() => items.length - 1);
    } else if (e.key === 'Enter' && open) {
      e.preventDefault();
      if (items[active]) onPick(items[active]);
    } else if (e.key === 'Escape') {
      if (open) {
        e.preventDefault();
        onClose();
      } else if (onEscapeClosed?.()) e.preventDefault();
    }
  };
}
