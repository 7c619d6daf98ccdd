import { randomUUID } from 'node:crypto';
import { defineEntity } from '@mikro-orm/core';

export const p = defineEntity.properties;

// Primary keys are UUIDs made in the application, so an id is known before the flush.
export const uuidPk = () => p.uuid().primary().onCreate(() => randomUUID());
export const createdAt = () => p.datetime().onCreate(() => new Date());

// double precision comes back from pg as a JS number.
export const double = () => p.double().$type<number>();
