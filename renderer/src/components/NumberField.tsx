// A number input that keeps a draft while it is typed and commits only a valid number, on Enter or
// when focus leaves, or, with `live`, at every keystroke that makes a valid number (like the table's
// value cells); a wrong draft stays in the field with its problem beside it.
import { useEffect, useId, useState, type ReactElement } from 'react';
import { formatNumber, readNumber } from '../editor/editorDocument';

interface NumberFieldProps {
  label: string;
  value: number;
  onCommit: (value: number) => void;
  /** A sentence when the number is not allowed, else null. */
  check?: (value: number) => string | null;
  suffix?: string;
  disabled?: boolean;
  testId?: string;
  width?: 'narrow' | 'normal';
  hint?: string;
  /** Apply each valid number as it is typed; onDone ends the typing (one undo step per visit). */
  live?: boolean;
  onDone?: () => void;
}

export function NumberField({ label, value, onCommit, check, suffix, disabled, testId, width = 'normal', hint, live = false, onDone }: NumberFieldProps): ReactElement {
  const [draft, setDraft] = useState<string | null>(null);
  const id = useId();
  useEffect(() => {
    // A live field keeps what is being typed ("2.", "1e3") while it reads as the value it applied.
    setDraft((d) => {
      if (d === null) return null;
      const r = readNumber(d);
      return live && r.ok && r.value === value ? d : null;
    });
  }, [value, live]);
  const text = draft ?? formatNumber(value);
  const read = readNumber(text);
  const problem = draft === null ? null : !read.ok ? read.message : (check?.(read.value) ?? null);

  const commit = () => {
    if (draft === null) return;
    if (read.ok && !problem) {
      if (read.value !== value) onCommit(read.value);
      setDraft(null);
    }
  };

  return (
    <div className={`field number-field ${width}`}>
      <label htmlFor={id}>{label}</label>
      <div className="input-with-suffix">
        <input
          id={id}
          value={text}
          inputMode="decimal"
          disabled={disabled}
          data-testid={testId}
          aria-invalid={problem ? true : undefined}
          onChange={(e) => {
            setDraft(e.target.value);
            if (!live) return;
            const typed = readNumber(e.target.value);
            if (typed.ok && !check?.(typed.value) && typed.value !== value) onCommit(typed.value);
          }}
          onBlur={() => {
            commit();
            onDone?.();
          }}
          onKeyDown={(e) => {
            if (e.key === 'Enter') commit();
            if (e.key === 'Escape') setDraft(null);
          }}
        />
        {suffix && <span className="suffix">{suffix}</span>}
      </div>
      {problem ? <p className="field-problem" role="alert">{problem}</p> : hint ? <p className="field-hint">{hint}</p> : null}
    </div>
  );
}
