import { describe, expect, it } from 'vitest';
import { signUpSchema, inviteMemberSchema } from '@/lib/schemas/accounts';
import { isCommonPassword } from '@/lib/schemas/common-passwords';
import { safeNextPath } from '@/lib/server/safe-redirect';
import { slugify } from '@/lib/server/services/accounts/create-organisation';
import { hashToken, newToken } from '@/lib/server/tokens';
import { fieldErrorsFromZod, toErrorBody, AppError } from '@/lib/server/errors';
import { isUuid, uuidOrNotFound } from '@/lib/server/ids';
import { CpInputError } from '@/lib/cp/errors';
import { ForecastInputError } from '@/lib/forecast/errors';
import { AnodeListInputError } from '@/lib/anode-list/errors';

describe('account input rules', () => {
  it('lower-cases and trims e-mail addresses', () => {
    expect(signUpSchema.parse({ name: ' Ada ', email: '  Ada@Example.COM ', password: 'long-enough-pass' }).email).toBe('ada@example.com');
  });

  it('names the failing fields', () => {
    const result = signUpSchema.safeParse({ name: '', email: 'not-an-address', password: 'short' });
    expect(result.success).toBe(false);
    const errors = fieldErrorsFromZod(result.error!);
    expect(Object.keys(errors).sort()).toEqual(['email', 'name', 'password']);
  });

  it('refuses common and patterned passwords, accepts a passphrase', () => {
    expect(isCommonPassword('Password123')).toBe(true);
    expect(isCommonPassword('1234567890')).toBe(true);
    expect(isCommonPassword('zzzzzzzzzzzz')).toBe(true);
    expect(isCommonPassword('sacrificial-zinc-on-the-rudder')).toBe(false);
  });

  it('refuses an unknown role', () => {
    expect(inviteMemberSchema.safeParse({ email: 'a@b.example', role: 'admiral' }).success).toBe(false);
  });
});

describe('small safety helpers', () => {
  it('only allows same-site return paths', () => {
    expect(safeNextPath('/o/acme/team')).toBe('/o/acme/team');
    expect(safeNextPath('//evil.example/x')).toBe('/orgs');
    // Browsers drop tabs and newlines from URLs: each of these would leave the site (common practice, WHATWG URL parsing).
    for (const hostile of ['/\t/evil.example/steal', '/\n/evil.example', '/\r\n/evil.example', '/\\evil.example', '/%09/evil.example'.replace('%09', '\t'), 'https://evil.example', '/\u0000x', ' /orgs']) {
      expect(safeNextPath(hostile), JSON.stringify(hostile)).toBe('/orgs');
    }
    // Encoded characters stay encoded in the path: they never become a second slash.
    expect(safeNextPath('/%2F%2Fevil.example')).toBe('/%2F%2Fevil.example');
    expect(safeNextPath('/o/acme/dockings?view=list#d1')).toBe('/o/acme/dockings?view=list#d1');
    expect(safeNextPath('https://evil.example')).toBe('/orgs');
    expect(safeNextPath('/\\evil.example')).toBe('/orgs');
    expect(safeNextPath(undefined)).toBe('/orgs');
  });

  it('makes URL slugs from organisation names', () => {
    expect(slugify('Østerhavn Havnevæsen & Co.')).toBe('osterhavn-havnevaesen-co');
    expect(slugify('A')).toBe('org-a');
  });

  it('makes 256-bit tokens and stores their SHA-256 only', () => {
    const token = newToken();
    expect(token).toMatch(/^[\w-]{43}$/);
    expect(hashToken(token)).toMatch(/^[0-9a-f]{64}$/);
    expect(hashToken(token)).not.toBe(hashToken(newToken()));
  });

  it('never sends the text of an unexpected error to the client', () => {
    const original = console.error;
    console.error = () => {};
    try {
      const { status, body } = toErrorBody(new Error('connection to 10.1.2.3 refused: password authentication failed'));
      expect(status).toBe(500);
      expect(body.error.message).not.toMatch(/10\.1|password/);
    } finally {
      console.error = original;
    }
    expect(toErrorBody(new AppError('forbidden', 'No.')).status).toBe(403);
  });

  it('maps every pure library\'s input error to 422 with the field named (one error type)', () => {
    for (const error of [new CpInputError('surfaces[0].areaM2', 'Area must be positive.'), new ForecastInputError('groups[3].currentA', 'Current must be positive.'), new AnodeListInputError('renewals[1].quantity', 'Quantity must be whole.')]) {
      const { status, body } = toErrorBody(error);
      expect(status).toBe(422);
      expect(body.error.fieldErrors).toEqual({ [error.field]: [error.message] });
    }
  });

  it('answers 404 for an id that is not a UUID, before any query', () => {
    expect(isUuid('3f5fbfd6-ea4d-4461-9892-0653a171a7a6')).toBe(true);
    for (const bad of ['', '1', 'not-a-uuid', "3f5fbfd6-ea4d-4461-9892-0653a171a7a6' or 1=1", '3f5fbfd6ea4d446198920653a171a7a6', null, 42]) {
      expect(isUuid(bad)).toBe(false);
      expect(() => uuidOrNotFound(bad, 'Zone')).toThrow(expect.objectContaining({ code: 'not-found', message: 'Zone was not found.' }));
    }
  });
});
