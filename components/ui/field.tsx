import { useId } from 'react';

interface FieldProps extends React.InputHTMLAttributes<HTMLInputElement> {
  label: string;
  name: string;
  errors?: string[];
  hint?: string;
  unit?: string;
}

/** A labelled input with its errors in place; the unit sits beside the number. */
export function Field({ label, name, errors, hint, unit, className = '', ...props }: FieldProps) {
  const id = useId();
  const describedBy = errors?.length ? `${id}-err` : hint ? `${id}-hint` : undefined;
  return (
    <div className={`flex min-w-0 flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-xs font-medium text-ink-soft">
        {label}
      </label>
      <div className="flex items-center gap-1.5">
        <input
          id={id}
          name={name}
          aria-invalid={errors?.length ? true : undefined}
          aria-describedby={describedBy}
          className={`w-full min-w-0 rounded-[3px] border bg-paper-raised px-2 py-1.5 text-sm outline-none max-sm:text-base focus:border-tide-500 max-lg:min-h-11 ${errors?.length ? 'border-state-action' : 'border-rule-strong'} ${props.type === 'number' ? 'num' : ''}`}
          {...props}
        />
        {unit ? <span className="min-w-8 text-xs text-ink-faint">{unit}</span> : null}
      </div>
      {errors?.length ? (
        <p id={`${id}-err`} role="alert" className="text-xs text-state-action">
          {errors.join(' ')}
        </p>
      ) : hint ? (
        <p id={`${id}-hint`} className="text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
    </div>
  );
}

interface SelectProps extends React.SelectHTMLAttributes<HTMLSelectElement> {
  label: string;
  name: string;
  errors?: string[];
  options: { value: string; label: string }[];
}

export function SelectField({ label, name, errors, options, className = '', ...props }: SelectProps) {
  const id = useId();
  return (
    <div className={`flex min-w-0 flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-xs font-medium text-ink-soft">
        {label}
      </label>
      <select
        id={id}
        name={name}
        aria-invalid={errors?.length ? true : undefined}
        className={`w-full min-w-0 rounded-[3px] border bg-paper-raised px-2 py-1.5 text-sm max-sm:text-base max-lg:min-h-11 ${errors?.length ? 'border-state-action' : 'border-rule-strong'}`}
        {...props}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      {errors?.length ? (
        <p role="alert" className="text-xs text-state-action">
          {errors.join(' ')}
        </p>
      ) : null}
    </div>
  );
}

export function FormMessage({ state }: { state: { ok: boolean; message?: string } }) {
  if (!state.message) return null;
  return (
    <p role={state.ok ? 'status' : 'alert'} className={`rounded-[3px] border px-3 py-2 text-sm ${state.ok ? 'border-state-sound/40 bg-state-soundbg text-state-sound' : 'border-state-action/40 bg-state-actionbg text-state-action'}`}>
      {state.message}
    </p>
  );
}
