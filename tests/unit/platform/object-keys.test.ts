import { describe, expect, it } from 'vitest';
import { attachmentObjectKey, isOrganisationKey, organisationPrefix } from '@/lib/server/storage/object-keys';
import { storageOrigin } from '@/lib/server/storage/storage-origin';
import { contentSecurityPolicy } from '@/lib/server/request-guard';

const ORG = '6f1c2b8e-3d4a-4c5b-9e6f-7a8b9c0d1e2f';
const OTHER = '0a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d';
const SURVEY = '11111111-2222-4333-8444-555555555555';

describe('object keys', () => {
  it("a survey file's key is under its organisation's prefix, with a fresh uuid each time", () => {
    const a = attachmentObjectKey(ORG, SURVEY);
    expect(a).toMatch(new RegExp(`^org/${ORG}/survey/${SURVEY}/[0-9a-f-]{36}$`));
    expect(attachmentObjectKey(ORG, SURVEY)).not.toBe(a);
    expect(attachmentObjectKey(ORG, SURVEY, 'fixed')).toBe(`org/${ORG}/survey/${SURVEY}/fixed`);
  });

  it("accepts only keys under the organisation's own prefix, without path tricks", () => {
    expect(isOrganisationKey(attachmentObjectKey(ORG, SURVEY), ORG)).toBe(true);
    expect(isOrganisationKey(attachmentObjectKey(OTHER, SURVEY), ORG)).toBe(false);
    expect(isOrganisationKey(`${organisationPrefix(ORG)}../${OTHER}/survey/x`, ORG)).toBe(false);
    expect(isOrganisationKey(`${organisationPrefix(ORG)}survey//x`, ORG)).toBe(false);
    expect(isOrganisationKey(`org/${ORG}`, ORG)).toBe(false);
  });
});

describe('the page policy and the storage origin', () => {
  it('adds the storage origin to img-src and connect-src only', () => {
    const origin = storageOrigin('https://files.example:9000/some/path');
    expect(origin).toBe('https://files.example:9000');
    const policy = contentSecurityPolicy({ nonce: 'n', https: true, development: false, formTargets: [], storageOrigin: origin });
    const directive = (name: string) => policy.split('; ').find((d) => d.startsWith(`${name} `));
    expect(directive('img-src')).toBe("img-src 'self' blob: data: https://files.example:9000");
    expect(directive('connect-src')).toBe("connect-src 'self' https://files.example:9000");
    expect(directive('script-src')).not.toContain('files.example');
    expect(directive('default-src')).toBe("default-src 'self'");
  });

  it('an unset or malformed endpoint adds nothing', () => {
    expect(storageOrigin(undefined)).toBeNull();
    expect(storageOrigin('not a url')).toBeNull();
    expect(contentSecurityPolicy({ nonce: 'n', https: false, development: false, formTargets: [], storageOrigin: null })).toContain("connect-src 'self';");
  });
});
