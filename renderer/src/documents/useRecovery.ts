// Autosave to a recovery copy every few seconds while there are unsaved changes, and the offer to
// restore it when the app starts again after a crash, a killed tab or a reload.
import { useCallback, useEffect, useRef, useState } from 'react';
import type { HostApi } from '../../../shared-core/host';
import { decodeRecovery, encodeRecovery, type RecoveredWork } from './recoveryCopy';

/** How long after a change the copy is written; typing on delays nothing past this (common practice, no source). */
export const RECOVERY_DELAY_MS = 2000;

export interface RecoveryOffer extends RecoveredWork {
  savedMs: number;
}

export interface RecoveryState {
  /** Work found from an earlier session, waiting for restore or discard. */
  offer: RecoveryOffer | null;
  /** When the current work was last kept, or null. */
  keptMs: number | null;
  restore(): RecoveredWork | null;
  discard(): void;
}

export function useRecovery(host: HostApi, current: RecoveredWork, dirty: boolean): RecoveryState {
  const [offer, setOffer] = useState<RecoveryOffer | null>(null);
  // Nothing is written or cleared until the earlier copy has been looked at, or it would be overwritten.
  const [checked, setChecked] = useState(false);
  const [keptMs, setKeptMs] = useState<number | null>(null);
  const latest = useRef(current);
  latest.current = current;
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);

  useEffect(() => {
    let live = true;
    void host.loadRecovery().then((r) => {
      if (!live) return;
      const work = r.ok && r.value ? decodeRecovery(r.value.text) : null;
      if (work && r.ok && r.value) setOffer({ ...work, savedMs: r.value.savedMs });
      setChecked(true);
    });
    return () => {
      live = false;
    };
  }, [host]);

  const holding = !checked || offer !== null;

  useEffect(() => {
    if (holding) return;
    if (!dirty) {
      if (timer.current) clearTimeout(timer.current);
      timer.current = null;
      setKeptMs(null);
      void host.clearRecovery();
      return;
    }
    if (timer.current) return;
    timer.current = setTimeout(() => {
      timer.current = null;
      void host.saveRecovery({ text: encodeRecovery(latest.current) }).then((r) => {
        if (r.ok) setKeptMs(r.value.savedMs);
      });
    }, RECOVERY_DELAY_MS);
  }, [host, dirty, holding, current.editor]);

  useEffect(() => () => {
    if (timer.current) clearTimeout(timer.current);
  }, []);

  const restore = useCallback((): RecoveredWork | null => {
    const work = offer;
    setOffer(null);
    return work;
  }, [offer]);

  const discard = useCallback(() => {
    setOffer(null);
    void host.clearRecovery();
  }, [host]);

  return { offer, keptMs, restore, discard };
}
