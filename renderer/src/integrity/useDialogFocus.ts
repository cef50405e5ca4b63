// Keyboard behaviour every integrity dialog shares (WAI-ARIA Authoring Practices, dialog (modal) pattern):
// focus moves into the dialog when it opens, Tab and Shift+Tab stay inside it, Escape closes it, and focus
// returns to the control that opened it (or to a fallback when that control is gone, e.g. a fixed finding).
import { useEffect, useRef, type KeyboardEvent, type RefObject } from 'react';

const FOCUSABLE = 'button:not(:disabled), input:not(:disabled), select:not(:disabled), textarea:not(:disabled), [href], [tabindex]:not([tabindex="-1"])';

export function useDialogFocus(onClose: () => void, fallback: () => HTMLElement | null): { ref: RefObject<HTMLDivElement | null>; onKeyDown: (e: KeyboardEvent) => void } {
  const ref = useRef<HTMLDivElement | null>(null);
  const fallbackRef = useRef(fallback);
  fallbackRef.current = fallback;
  useEffect(() => {
    const opener = document.activeElement as HTMLElement | null;
    const first = ref.current?.querySelector<HTMLElement>('[data-autofocus]') ?? ref.current?.querySelector<HTMLElement>(FOCUSABLE);
    first?.focus();
    return () => {
      // After React commits the change the dialog made: the opener may have been removed with its finding.
      setTimeout(() => {
        if (opener && opener.isConnected) opener.focus();
        else fallbackRef.current()?.focus();
      }, 0);
    };
  }, []);
  const onKeyDown = (e: KeyboardEvent) => {
    if (e.key === 'Escape') {
      e.stopPropagation();
      e.preventDefault();
      onClose();
      return;
    }
    if (e.key !== 'Tab') return;
    const items = Array.from(ref.current?.querySelectorAll<HTMLElement>(FOCUSABLE) ?? []);
    if (items.length === 0) return;
    const first = items[0];
    const last = items[items.length - 1];
    if (e.shiftKey && document.activeElement === first) {
      e.preventDefault();
      last.focus();
    } else if (!e.shiftKey && document.activeElement === last) {
      e.preventDefault();
      first.focus();
    }
  };
  return { ref, onKeyDown };
}
