// The offer to bring back work that was not saved when the app last closed.
import type { ReactElement } from 'react';
import type { RecoveryOffer } from '../documents/useRecovery';
import '../documents/documents.css';

function when(ms: number): string {
  const d = new Date(ms);
  const sameDay = d.toDateString() === new Date().toDateString();
  const time = d.toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });
  return sameDay ? `today at ${time}` : `${d.toLocaleDateString()} at ${time}`;
}

export function RecoveryBanner({ offer, onRestore, onDiscard }: { offer: RecoveryOffer; onRestore: () => void; onDiscard: () => void }): ReactElement {
  return (
    <div className="recovery-banner" role="region" aria-live="polite" aria-labelledby="recovery-title" aria-describedby="recovery-text" data-testid="recovery-banner">
      <strong id="recovery-title">Unsaved work was found</strong>
      <span id="recovery-text">
        “{offer.name}”, kept {when(offer.savedMs)}, was not saved before the app closed. Restore it, or discard it and keep what is open now.
      </span>
      <span className="spacer" />
      <button type="button" className="button" onClick={onDiscard} data-testid="recovery-discard">
        Discard
      </button>
      <button type="button" className="button primary" onClick={onRestore} data-testid="recovery-restore">
        Restore
      </button>
    </div>
  );
}
