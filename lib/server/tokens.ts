import { createHash, randomBytes } from 'node:crypto';

/** A URL-safe random token (256 bits) for e-mailed links. */
export const newToken = () => randomBytes(32).toString('base64url');

/** Tokens are stored only as their SHA-256, so a database leak does not expose working links. */
export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');
