import { TONE_SPECS, type StatusShape, type StatusTone } from '@/lib/status/palette';
import { SHAPE_MARKUP, STATUS_TAG_CLASSES } from '@/lib/status/shape-markup';

export type { StatusTone } from '@/lib/status/palette';

/** The shape of each tone, drawn in the text colour: the second cue after the word, the colour is the third. */
function ShapeIcon({ shape }: { shape: StatusShape }) {
  return <svg width={10} height={10} viewBox="0 0 10 10" aria-hidden focusable={false} className="shrink-0" data-shape={shape} dangerouslySetInnerHTML={{ __html: SHAPE_MARKUP[shape] ?? SHAPE_MARKUP.dash }} />;
}

/** A status in words, with the tone's shape and colour as second and third cues (lib/status/palette.ts). */
export function StatusTag({ tone, children }: { tone: StatusTone; children: React.ReactNode }) {
  const spec = TONE_SPECS[tone] ?? TONE_SPECS.neutral;
  return (
    <span data-tone={tone} className={`${STATUS_TAG_CLASSES} ${spec.classes}`}>
      <ShapeIcon shape={spec.shape} />
      {children}
    </span>
  );
}
