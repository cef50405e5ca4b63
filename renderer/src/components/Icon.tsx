// Small line icons drawn for this app on a 16-unit grid, 1.5 units wide, round ends.
import type { ReactElement } from 'react';

const PATHS = {
  undo: 'M5.5 4 2.5 7l3 3M3 7h6.5a4 4 0 0 1 0 8H7',
  redo: 'M10.5 4l3 3-3 3M13 7H6.5a4 4 0 0 0 0 8H9',
  open: 'M2 4.5h4l1.5 1.5H14v7H2zM2 8h12',
  save: 'M3 2.5h8l2 2v9H3zM5.5 2.5v3h5v-3M5.5 13.5v-4h5v4',
  export: 'M8 2v8M4.5 5.5 8 2l3.5 3.5M2.5 10v3.5h11V10',
  plus: 'M8 3v10M3 8h10',
  cross: 'M4 4l8 8M12 4l-8 8',
  up: 'M4 10l4-4 4 4',
  down: 'M4 6l4 4 4-4',
  paste: 'M5.5 3H3.5v11h9V3h-2M5.5 2h5v2.5h-5zM6 8h4M6 10.5h4',
  swap: 'M3 5.5h9.5L10 3M13 10.5H3.5L6 13',
  search: 'M7 12a5 5 0 1 1 0-10 5 5 0 0 1 0 10zM10.5 10.5 14 14',
  recent: 'M8 14A6 6 0 1 0 2.3 6M2 2.5V6h3.5M8 5v3.5l2.5 1.5',
  check: 'M3 8.5l3.5 3.5L13 4.5',
  stop: 'M8 1.8 14.2 8 8 14.2 1.8 8zM8 5v3.8M8 10.6v.4',
} as const;

export type IconName = keyof typeof PATHS;

export function Icon({ name, size = 16 }: { name: IconName; size?: number }): ReactElement {
  return (
    <svg className="icon" width={size} height={size} viewBox="0 0 16 16" aria-hidden="true" focusable="false">
      <path d={PATHS[name]} fill="none" stroke="currentColor" strokeWidth="1.5" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}

/** The app's mark: three whole tiles and one cut by ink, the idea of the product in one glance. */
export function BrandMark(): ReactElement {
  return (
    <svg className="brand-mark" width="22" height="22" viewBox="0 0 22 22" aria-hidden="true">
      <rect x="1" y="1" width="9" height="9" rx="2" fill="currentColor" />
      <rect x="12" y="1" width="9" height="9" rx="2" fill="currentColor" />
      <rect x="1" y="12" width="9" height="9" rx="2" fill="currentColor" />
      <rect x="12" y="12" width="9" height="9" rx="2" fill="none" stroke="currentColor" strokeWidth="1.2" />
      <path d="M12 16.5h9V19a2 2 0 0 1-2 2h-5a2 2 0 0 1-2-2z" fill="currentColor" />
    </svg>
  );
}
