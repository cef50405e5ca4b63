// A row of segment buttons that behaves as a radio group (WAI-ARIA Authoring Practices, "Radio Group
// Pattern"): one Tab stop, on the checked option; arrow keys move to the next or previous option and
// check it, wrapping at the ends; Space checks the focused option.
import { useRef, type KeyboardEvent, type ReactElement } from 'react';

export interface RadioOption<Value extends string> {
  value: Value;
  label: string;
  title?: string;
}

interface RadioGroupProps<Value extends string> {
  /** The id of the element that names the group. */
  labelledBy: string;
  options: readonly RadioOption<Value>[];
  value: Value;
  onChange: (value: Value) => void;
  testId?: string;
}

export function RadioGroup<Value extends string>({ labelledBy, options, value, onChange, testId }: RadioGroupProps<Value>): ReactElement {
  const buttons = useRef<(HTMLButtonElement | null)[]>([]);
  const checkedIndex = Math.max(0, options.findIndex((o) => o.value === value));

  const onKeyDown = (e: KeyboardEvent<HTMLButtonElement>, index: number) => {
    let next: number | null = null;
    if (e.key === 'ArrowRight' || e.key === 'ArrowDown') next = (index + 1) % options.length;
    else if (e.key === 'ArrowLeft' || e.key === 'ArrowUp') next = (index - 1 + options.length) % options.length;
    else if (e.key === ' ') {
      e.preventDefault();
      if (options[index].value !== value) onChange(options[index].value);
      return;
    }
    if (next === null) return;
    e.preventDefault();
    buttons.current[next]?.focus();
    if (options[next].value !== value) onChange(options[next].value);
  };

  return (
    <div className="segmented" role="radiogroup" aria-labelledby={labelledBy} data-testid={testId}>
      {options.map((o, i) => {
        const checked = o.value === value;
        return (
          <button
            key={o.value}
            ref={(el) => {
              buttons.current[i] = el;
            }}
            type="button"
            role="radio"
            aria-checked={checked}
            tabIndex={i === checkedIndex ? 0 : -1}
            className={checked ? 'segment active' : 'segment'}
            title={o.title}
            onClick={() => {
              if (!checked) onChange(o.value);
            }}
            onKeyDown={(e) => onKeyDown(e, i)}
          >
            {o.label}
          </button>
        );
      })}
    </div>
  );
}
