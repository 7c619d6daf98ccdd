// Against the served app (`next start` as the start scripts run it): a client that writes its own
// X-Forwarded-For is still counted on the address it connects from. The guesses are sent from an address
// of their own in 127/8, so the block they earn does not touch the other specs' sign-ins from 127.0.0.1.
import { randomInt } from 'node:crypto';
import { expect, test } from '@playwright/test';
import { guess, newPeer, signInForm } from '../../fixtures/raw-sign-in';

const base = new URL(process.env.E2E_BASE_URL ?? 'http://127.0.0.1:3100');
const peer = newPeer();

const signInFormHere = () => signInForm(base, peer);
const guessHere = (fields: [string, string][], email: string, spoofed: string) => guess(base, peer, fields, email, { 'x-forwarded-for': spoofed });

test('60 password guesses over many accounts with a rotating X-Forwarded-For are blocked on the real address', async () => {
  test.setTimeout(180_000);
  const fields = await signInFormHere();
  const outcomes: string[] = [];
  for (let i = 0; i < 60; i++) {
    outcomes.push(await guessHere(fields, `spray-${i}-${randomInt(1e9)}@e2e.example`, `10.${i}.${randomInt(255)}.${randomInt(255)}`));
  }
  const firstBlocked = outcomes.indexOf('blocked');
  expect(outcomes.filter((o) => o !== 'refused' && o !== 'blocked')).toEqual([]);
  expect(firstBlocked, outcomes.join(' ')).toBeGreaterThan(0);
  // Once blocked, every further guess stays blocked, whatever the header says.
  expect(outcomes.slice(firstBlocked).every((o) => o === 'blocked')).toBe(true);
  expect(outcomes.filter((o) => o === 'refused').length).toBeLessThanOrEqual(50);
});
