import type { DeskInputsDraft } from '@/lib/schemas/design';

export type DeskState = DeskInputsDraft;
export type Update = (change: (previous: DeskState) => DeskState) => void;
