'use client';
import { useState, type ComponentProps } from 'react';
import { Field } from '@/components/ui/field';
import { formatPosition, parsePosition, type PositionAssetKind } from '@/lib/drawings/parse-position';

/** How a position text will be read, in words: "Read as: Frames 22–30, port; clear of the log" (null for a blank text). */
export function readAsWords(text: string, kind?: PositionAssetKind): string | null {
  if (!text.trim()) return null;
  const p = parsePosition(text, kind);
  const understood = Object.entries(p).some(([k, v]) => k !== 'note' && v !== null);
  return understood ? `Read as: ${formatPosition(p)}` : 'Read as: nothing placed on the drawing; kept as a note.';
}

/**
 * A position field with a live preview under it of what the parser understood (parsePosition is pure, so it runs
 * in the browser as the engineer types): the words the drawing will use, before anything is saved.
 */
export function PositionField({ kind, defaultValue, onChange, ...props }: ComponentProps<typeof Field> & { kind?: PositionAssetKind; defaultValue?: string }) {
  const [typed, setTyped] = useState<{ from: string | undefined; text: string } | null>(null);
  // A new starting value (another group chosen, values sent back after a refusal) replaces what was typed.
  const text = typed && typed.from === defaultValue ? typed.text : (defaultValue ?? '');
  const words = readAsWords(text, kind);
  return (
    <div className={`flex min-w-0 flex-col gap-1 ${props.className ?? ''}`}>
      <Field
        {...props}
        className=""
        defaultValue={defaultValue}
        onChange={(ev) => {
          setTyped({ from: defaultValue, text: ev.target.value });
          onChange?.(ev);
        }}
      />
      <p className="text-xs text-ink-soft" aria-live="polite">
        {words ?? ''}
      </p>
    </div>
  );
}
