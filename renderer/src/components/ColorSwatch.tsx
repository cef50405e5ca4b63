// A colour swatch that opens the system colour picker. While the picker is dragged each colour is
// applied at once (onPick with typing), and the whole visit is one undo step: onDone seals it when the
// picker reports its final choice ("change") or focus leaves. An automatic swatch shows the colour it
// stands for with a dashed ring, so "not set" and "set to the palette's colour" look different.
import { useEffect, useRef, type ReactElement } from 'react';

interface ColorSwatchProps {
  /** The colour shown (the own colour, or the automatic one). */
  color: string;
  /** True when no colour of its own is set and `color` is what "automatic" gives. */
  automatic?: boolean;
  /** Accessible name, e.g. "Colour of row 2: automatic (#cc6677)". */
  label: string;
  onPick: (color: string) => void;
  onDone: () => void;
  testId?: string;
}

export function ColorSwatch({ color, automatic = false, label, onPick, onDone, testId }: ColorSwatchProps): ReactElement {
  const input = useRef<HTMLInputElement>(null);
  // React's onChange on an <input> is the DOM "input" event; the picker's final choice is the native "change".
  useEffect(() => {
    const el = input.current;
    if (!el) return;
    el.addEventListener('change', onDone);
    return () => el.removeEventListener('change', onDone);
  }, [onDone]);
  const value = /^#[0-9a-f]{6}$/i.test(color) ? color.toLowerCase() : '#000000';
  return (
    <label className={automatic ? 'color-swatch automatic' : 'color-swatch'} style={{ background: value }} title={label}>
      <input ref={input} type="color" value={value} aria-label={label} data-testid={testId} onChange={(e) => onPick(e.target.value)} onBlur={onDone} />
    </label>
  );
}
