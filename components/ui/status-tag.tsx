import { TONE_SPECS, type StatusShape, type StatusTone } from '@/lib/status/palette';

export type { StatusTone } from '@/lib/status/palette';

/** The shape of each tone, drawn in the text colour: the second cue after the word, the colour is the third. */
function ShapeIcon({ shape }: { shape: StatusShape }) {
  const common = { width: 10, height: 10, viewBox: '0 0 10 10', 'aria-hidden': true, focusable: false, className: 'shrink-0', 'data-shape': shape } as const;
  switch (shape) {
    case 'triangle':
      return (
        <svg {...common}>
          <path d="M5 0.6 L9.6 9.2 H0.4 Z" fill="currentColor" />
          <path d="M5 3.4 V6.2 M5 7.2 V7.9" stroke="#fff" strokeWidth="1.2" />
        </svg>
      );
    case 'clock':
      return (
        <svg {...common}>
          <circle cx="5" cy="5" r="4.2" fill="none" stroke="currentColor" strokeWidth="1.4" />
          <path d="M5 2.4 V5 H7.2" fill="none" stroke="currentColor" strokeWidth="1.3" />
        </svg>
      );
    case 'check':
      return (
        <svg {...common}>
          <path d="M1 5.4 L3.9 8.2 L9 1.8" fill="none" stroke="currentColor" strokeWidth="1.7" />
        </svg>
      );
    case 'arrow':
      return (
        <svg {...common}>
          <path d="M0.8 5 H8 M5 1.8 L8.4 5 L5 8.2" fill="none" stroke="currentColor" strokeWidth="1.5" />
        </svg>
      );
    case 'plus':
      return (
        <svg {...common}>
          <circle cx="5" cy="5" r="4.3" fill="currentColor" />
          <path d="M5 2.5 V7.5 M2.5 5 H7.5" stroke="#fff" strokeWidth="1.4" />
        </svg>
      );
    default:
      return (
        <svg {...common}>
          <path d="M1.5 5 H8.5" stroke="currentColor" strokeWidth="1.6" />
        </svg>
      );
  }
}

/** A status in words, with the tone's shape and colour as second and third cues (lib/status/palette.ts). */
export function StatusTag({ tone, children }: { tone: StatusTone; children: React.ReactNode }) {
  const spec = TONE_SPECS[tone] ?? TONE_SPECS.neutral;
  return (
    <span data-tone={tone} className={`inline-flex items-center gap-1 rounded-[3px] border px-1.5 py-0.5 text-xs font-medium ${spec.classes}`}>
      <ShapeIcon shape={spec.shape} />
      {children}
    </span>
  );
}
