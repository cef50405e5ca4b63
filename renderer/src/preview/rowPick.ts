// Picking a category in the honesty table to see its marks in the preview. A context rather than
// props, so the table's component only has to spread the row's attributes.
import { createContext, type HTMLAttributes, type KeyboardEvent } from 'react';

export interface RowPick {
  pickedLabel: string | null;
  onPick: (label: string) => void;
}

export const RowPickContext = createContext<RowPick | null>(null);

/** Attributes that make a table row pickable by click, Enter or Space, and mark the picked one (WAI-ARIA aria-selected). */
export function pickableRow(pick: RowPick | null, label: string, active = true): HTMLAttributes<HTMLTableRowElement> & { 'data-pickable'?: string } {
  if (!pick || !active) return {};
  return {
    tabIndex: 0,
    'aria-selected': pick.pickedLabel === label,
    'data-pickable': 'true',
    title: pick.pickedLabel === label ? 'Showing its marks in the preview; click again to show all' : 'Show this category’s marks in the preview',
    onClick: () => pick.onPick(label),
    onKeyDown: (e: KeyboardEvent<HTMLTableRowElement>) => {
      if (e.key === 'Enter' || e.key === ' ') {
        e.preventDefault();
        pick.onPick(label);
      }
    },
  };
}
