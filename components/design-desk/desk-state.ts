import type { DeskInputsDraft } from '@/lib/schemas/design';

export type DeskState = DeskInputsDraft;
export type Update = (change: (previous: DeskState) => DeskState) => void;

/** The first message for a field path such as "surfaces.2.areaM2". */
export const errorAt = (errors: Record<string, string[]>, path: string) => errors[path];
