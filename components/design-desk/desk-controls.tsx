'use client';
import { useId } from 'react';

interface NumberProps {
  label: string;
  value: number | string | null | undefined;
  onChange: (value: string) => void;
  unit?: string;
  errors?: string[];
  hint?: string;
  disabled?: boolean;
  step?: string;
}

/** A compact labelled number with its unit and its error in place. */
export function NumberInput({ label, value, onChange, unit, errors, hint, disabled, step = 'any' }: NumberProps) {
  const id = useId();
  return (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={id} className="text-xs text-ink-soft">
        {label}
      </label>
      <div className="flex items-center gap-1">
        <input
          id={id}
          type="number"
          step={step}
          inputMode="decimal"
          value={value ?? ''}
          disabled={disabled}
          onChange={(e) => onChange(e.target.value)}
          aria-invalid={errors?.length ? true : undefined}
          className={`num w-full min-w-0 rounded-[3px] border bg-paper-raised px-1.5 py-1 text-sm disabled:bg-paper-sunk ${errors?.length ? 'border-state-action' : 'border-rule-strong'}`}
        />
        {unit ? <span className="shrink-0 text-2xs text-ink-faint">{unit}</span> : null}
      </div>
      {errors?.length ? (
        <p role="alert" className="text-2xs text-state-action">
          {errors[0]}
        </p>
      ) : hint ? (
        <p className="text-2xs text-ink-faint">{hint}</p>
      ) : null}
    </div>
  );
}

interface SelectProps {
  label: string;
  value: string | null | undefined;
  onChange: (value: string) => void;
  options: { value: string; label: string }[];
  errors?: string[];
  disabled?: boolean;
}

export function SelectInput({ label, value, onChange, options, errors, disabled }: SelectProps) {
  const id = useId();
  return (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={id} className="text-xs text-ink-soft">
        {label}
      </label>
      <select
        id={id}
        value={value ?? ''}
        disabled={disabled}
        onChange={(e) => onChange(e.target.value)}
        className={`rounded-[3px] border bg-paper-raised px-1.5 py-1 text-sm disabled:bg-paper-sunk ${errors?.length ? 'border-state-action' : 'border-rule-strong'}`}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      {errors?.length ? (
        <p role="alert" className="text-2xs text-state-action">
          {errors[0]}
        </p>
      ) : null}
    </div>
  );
}

export function CheckboxInput({ label, checked, onChange, disabled }: { label: string; checked: boolean; onChange: (checked: boolean) => void; disabled?: boolean }) {
  return (
    <label className="flex items-center gap-2 text-sm text-ink">
      <input type="checkbox" checked={checked} disabled={disabled} onChange={(e) => onChange(e.target.checked)} className="accent-tide-600" />
      {label}
    </label>
  );
}

export const optionsFrom = (labels: Record<string, string>, values: readonly string[]) => values.map((v) => ({ value: v, label: labels[v] ?? v }));
